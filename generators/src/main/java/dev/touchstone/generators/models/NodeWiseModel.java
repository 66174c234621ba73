package dev.touchstone.generators.models;

import dev.touchstone.core.data.CovarianceMatrix;
import dev.touchstone.core.data.DataKind;
import dev.touchstone.core.data.DataSet;
import dev.touchstone.core.data.Variable;
import dev.touchstone.core.graph.Graph;
import dev.touchstone.core.graph.algorithms.Ancestry;
import dev.touchstone.core.random.Seeds;

import java.util.ArrayList;
import java.util.Arrays;
import java.util.Collections;
import java.util.Comparator;
import java.util.List;
import java.util.Optional;
import java.util.Set;
import java.util.function.Supplier;

/**
 * A structural model given as one {@link NodeMechanism} per variable, sampled in
 * topological order with one random stream per variable (seeded with
 * {@code Seeds.derive(seed, "variable", name)}), optionally standardised with fixed
 * (population or pilot) moments and with shuffled columns. Cost per sample: the
 * mechanisms' cost, O(rows · (p + edges)) for linear models; memory: the columns only.
 */
final class NodeWiseModel implements StructuralModel {

    /** Rows per block when every mechanism can fill block by block. */
    private static final int BLOCK_ROWS = 1024;

    private final Graph graph;
    private final String kindId;
    private final Variable[] variables;
    private final NodeMechanism[] mechanisms;
    private final int[] topological;
    private final double[] centre;
    private final double[] scale;
    private final double[] columnKey;
    private final Supplier<Optional<CovarianceMatrix>> fullCovariance;
    private final List<String> columnOrder;
    private final int[] observedInColumnOrder;

    /**
     * @param centre         per variable, subtracted when standardising (null: no standardisation)
     * @param scale          per variable, divided by when standardising (NaN for discrete variables)
     * @param columnKey      per variable, observed columns are sorted by this key (null: graph order)
     * @param fullCovariance the exact covariance of all variables before standardisation, if defined
     */
    NodeWiseModel(Graph graph, String kindId, Variable[] variables, NodeMechanism[] mechanisms,
                  double[] centre, double[] scale, double[] columnKey,
                  Supplier<Optional<CovarianceMatrix>> fullCovariance) {
        this.graph = graph;
        this.kindId = kindId;
        this.variables = variables;
        this.mechanisms = mechanisms;
        int[] topo = Ancestry.topologicalOrder(graph);
        if (topo == null) {
            throw new IllegalArgumentException("the model's graph has a directed cycle");
        }
        this.topological = topo;
        this.centre = centre;
        this.scale = scale;
        this.columnKey = columnKey;
        this.fullCovariance = fullCovariance;
        List<Integer> observed = new ArrayList<>();
        for (int v : graph.observedIndices()) {
            observed.add(v);
        }
        if (columnKey != null) {
            observed.sort(Comparator.comparingDouble(v -> columnKey[v]));
        }
        this.observedInColumnOrder = observed.stream().mapToInt(Integer::intValue).toArray();
        List<String> names = new ArrayList<>();
        for (int v : observedInColumnOrder) {
            names.add(graph.name(v));
        }
        this.columnOrder = Collections.unmodifiableList(names);
    }

    @Override
    public Graph graph() {
        return graph;
    }

    @Override
    public String kindId() {
        return kindId;
    }

    @Override
    public DataKind dataKind() {
        boolean discrete = false;
        boolean continuous = false;
        for (int v : observedInColumnOrder) {
            if (variables[v].isDiscrete()) {
                discrete = true;
            } else {
                continuous = true;
            }
        }
        return discrete && continuous ? DataKind.MIXED : discrete ? DataKind.DISCRETE : DataKind.CONTINUOUS;
    }

    @Override
    public List<String> columnOrder() {
        return columnOrder;
    }

    /** The variable declared for graph index {@code v}. */
    Variable variable(int v) {
        return variables[v];
    }

    /** The mechanism of graph index {@code v} (for tests and inspection in this package). */
    NodeMechanism mechanism(int v) {
        return mechanisms[v];
    }

    /** Whether columns are standardised after generation. */
    boolean standardises() {
        return centre != null;
    }

    @Override
    public DataSet sampleComplete(int rows, long seed) {
        if (rows < 0) {
            throw new IllegalArgumentException("cannot sample " + rows + " rows");
        }
        Object[] columns = fillColumns(rows, seed);
        if (centre != null) {
            for (int v = 0; v < columns.length; v++) {
                if (columns[v] instanceof double[] && !Double.isNaN(scale[v])) {
                    double[] x = (double[]) columns[v];
                    double c = centre[v];
                    double inv = 1.0 / scale[v];
                    for (int r = 0; r < rows; r++) {
                        x[r] = (x[r] - c) * inv;
                    }
                }
            }
        }
        DataSet.Builder b = DataSet.builder(rows);
        for (int v = 0; v < columns.length; v++) {
            if (variables[v].isDiscrete()) {
                b.discrete(variables[v], (int[]) columns[v]);
            } else {
                b.continuous(variables[v].name(), (double[]) columns[v]);
            }
        }
        return b.build();
    }

    /** The raw columns (no standardisation), by graph index. */
    Object[] fillColumns(int rows, long seed) {
        Object[] columns = new Object[graph.size()];
        NodeMechanism.BlockFiller[] fillers = new NodeMechanism.BlockFiller[graph.size()];
        boolean blockwise = true;
        for (int v : topological) {
            fillers[v] = mechanisms[v].blocks(columns, rows, stream(seed, v));
            if (fillers[v] == null) {
                blockwise = false;
                break;
            }
        }
        if (blockwise) {
            // Row blocks outermost: each block of every parent is still in cache when its
            // children read it. Streams are consumed in row order, so values do not change.
            for (int from = 0; from < rows; from += BLOCK_ROWS) {
                int to = Math.min(rows, from + BLOCK_ROWS);
                for (int v : topological) {
                    fillers[v].fill(from, to);
                }
            }
            return columns;
        }
        java.util.Arrays.fill(columns, null);
        for (int v : topological) {
            mechanisms[v].fill(columns, rows, stream(seed, v));
        }
        return columns;
    }

    private org.apache.commons.rng.UniformRandomProvider stream(long seed, int v) {
        return Seeds.random(Seeds.derive(seed, "variable", graph.name(v)));
    }

    @Override
    public DataSet observe(DataSet complete) {
        int[] cols = new int[observedInColumnOrder.length];
        for (int k = 0; k < cols.length; k++) {
            int j = complete.indexOf(graph.name(observedInColumnOrder[k]));
            if (j < 0) {
                throw new IllegalArgumentException("the data set has no column '" + graph.name(observedInColumnOrder[k]) + "'");
            }
            cols[k] = j;
        }
        return complete.select(cols);
    }

    @Override
    public Optional<CovarianceMatrix> populationCovariance() {
        Optional<CovarianceMatrix> full = fullCovariance.get();
        if (full.isEmpty()) {
            return full;
        }
        CovarianceMatrix sub = full.get().select(observedInColumnOrder);
        if (centre == null) {
            return Optional.of(sub);
        }
        int q = observedInColumnOrder.length;
        double[] s = sub.toArray();
        for (int a = 0; a < q; a++) {
            for (int b = 0; b < q; b++) {
                s[a * q + b] /= scale[observedInColumnOrder[a]] * scale[observedInColumnOrder[b]];
            }
        }
        return Optional.of(CovarianceMatrix.of(columnOrder, s, CovarianceMatrix.INFINITE_SAMPLE));
    }

    @Override
    public ModelParameters parameters() {
        List<NodeParameters> nodes = new ArrayList<>();
        java.util.Map<String, NodeParameters.Scaling> standardised = new java.util.LinkedHashMap<>();
        for (int v = 0; v < mechanisms.length; v++) {
            nodes.add(mechanisms[v].describe(graph, variables));
            if (centre != null && !Double.isNaN(scale[v])) {
                standardised.put(graph.name(v), new NodeParameters.Scaling(centre[v], scale[v]));
            }
        }
        return new ModelParameters(kindId, graph, nodes, columnOrder, standardised);
    }

    @Override
    public StructuralModel withHidden(Set<String> hidden) {
        return new NodeWiseModel(graph.withHidden(hidden), kindId, variables, mechanisms, centre, scale, columnKey,
                fullCovariance);
    }

    /** The same model with standardisation by these moments (null centre: none). */
    NodeWiseModel withStandardisation(double[] newCentre, double[] newScale) {
        return new NodeWiseModel(graph, kindId, variables, mechanisms, newCentre, newScale, columnKey, fullCovariance);
    }

    /** The same model with observed columns sorted by this key (null: graph order). */
    NodeWiseModel withColumnKey(double[] key) {
        return new NodeWiseModel(graph, kindId, variables, mechanisms, centre, scale, key, fullCovariance);
    }

    @Override
    public String toString() {
        return kindId + " model over " + Arrays.toString(graph.names().toArray());
    }
}

package dev.touchstone.generators.models;

import dev.touchstone.core.data.CovarianceMatrix;
import dev.touchstone.core.data.Variable;
import dev.touchstone.core.graph.Graph;
import dev.touchstone.core.param.ParameterException;
import dev.touchstone.core.param.ParameterValues;
import org.apache.commons.rng.UniformRandomProvider;
import org.apache.commons.rng.sampling.distribution.DirichletSampler;

import java.util.Arrays;
import java.util.HashSet;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.Optional;
import java.util.Set;

/**
 * Discrete Bayesian networks: one conditional probability table per variable given its
 * parents (Pearl 1988, Probabilistic Reasoning in Intelligent Systems). Random tables come
 * from {@link DiscreteNetworkKind}; given tables (such as the published ones of reference
 * networks) from {@link #builder(Graph)}. Sampling is forward (ancestral) sampling: one
 * uniform draw and a table search per variable per row.
 */
public final class DiscreteNetworkModel {

    /** Refuse tables with more parent configurations than this (memory and sense). */
    static final long MAX_CONFIGURATIONS = 1_000_000;

    private DiscreteNetworkModel() {
    }

    /** A builder of a network with given tables over {@code dag}. */
    public static Builder builder(Graph dag) {
        return new Builder(dag);
    }

    static StructuralModel drawRandom(String kindId, Graph dag, ParameterValues values, UniformRandomProvider random) {
        int low = values.getInt(DiscreteNetworkKind.CARDINALITY_LOW.name());
        int high = values.getInt(DiscreteNetworkKind.CARDINALITY_HIGH.name());
        ModelOptions.checkRange(DiscreteNetworkKind.CARDINALITY_LOW.name(), low,
                DiscreteNetworkKind.CARDINALITY_HIGH.name(), high);
        double alpha = values.getDouble(DiscreteNetworkKind.CONCENTRATION.name());
        int p = dag.size();
        int[] card = new int[p];
        Variable[] vars = new Variable[p];
        for (int v = 0; v < p; v++) {
            card[v] = low + random.nextInt(high - low + 1);
            vars[v] = Variable.discrete(dag.name(v), card[v]);
        }
        NodeMechanism[] mech = new NodeMechanism[p];
        for (int v = 0; v < p; v++) {
            int[] parents = dag.parents(v);
            int[] pc = new int[parents.length];
            for (int k = 0; k < parents.length; k++) {
                pc[k] = card[parents[k]];
            }
            int configs = configurations(dag.name(v), pc);
            DirichletSampler dirichlet = DirichletSampler.symmetric(random, card[v], alpha);
            double[][] table = new double[configs][];
            for (int c = 0; c < configs; c++) {
                table[c] = dirichlet.sample();
            }
            mech[v] = new DiscreteMechanism(v, parents, pc, table);
        }
        NodeWiseModel raw = new NodeWiseModel(dag, kindId, vars, mech, null, null, null, Optional::<CovarianceMatrix>empty);
        return ModelOptions.apply(raw, values, null, random);
    }

    static int configurations(String child, int[] parentCategories) {
        long n = 1;
        for (int c : parentCategories) {
            n *= c;
            if (n > MAX_CONFIGURATIONS) {
                throw new ParameterException("categories_high", String.format(Locale.ROOT,
                        "variable '%s' would have a table with more than %d parent configurations; "
                                + "lower the categories or the in-degree", child, MAX_CONFIGURATIONS));
            }
        }
        return (int) n;
    }

    /**
     * Collects categories and tables for every variable of a DAG and checks them: every
     * variable needs categories and a table whose parents are exactly its parents in the
     * DAG, with one row per parent configuration (last parent varying fastest), each row
     * non-negative and summing to 1 within 1e-9.
     */
    public static final class Builder {
        private final Graph dag;
        private final Map<String, List<String>> categories = new LinkedHashMap<>();
        private final Map<String, List<String>> parentOrder = new LinkedHashMap<>();
        private final Map<String, double[][]> tables = new LinkedHashMap<>();

        private Builder(Graph dag) {
            this.dag = dag;
        }

        /** Declares the categories of a variable, in code order. */
        public Builder variable(String name, List<String> cats) {
            dag.index(name);
            if (cats.size() < 2) {
                throw new IllegalArgumentException("variable '" + name + "' needs at least two categories");
            }
            categories.put(name, List.copyOf(cats));
            return this;
        }

        /**
         * Gives the table of {@code child}: {@code rows[c]} is the distribution of the child for
         * the c-th configuration of {@code parents} (the last parent varying fastest).
         */
        public Builder table(String child, List<String> parents, double[]... rows) {
            dag.index(child);
            parentOrder.put(child, List.copyOf(parents));
            double[][] copy = new double[rows.length][];
            for (int i = 0; i < rows.length; i++) {
                copy[i] = rows[i].clone();
            }
            tables.put(child, copy);
            return this;
        }

        /** The model, under the id {@code kindId}. */
        public StructuralModel build(String kindId) {
            int p = dag.size();
            Variable[] vars = new Variable[p];
            for (int v = 0; v < p; v++) {
                List<String> cats = categories.get(dag.name(v));
                if (cats == null) {
                    throw new IllegalArgumentException("variable '" + dag.name(v) + "' has no categories");
                }
                vars[v] = Variable.discrete(dag.name(v), cats);
            }
            NodeMechanism[] mech = new NodeMechanism[p];
            for (int v = 0; v < p; v++) {
                String name = dag.name(v);
                double[][] table = tables.get(name);
                if (table == null) {
                    throw new IllegalArgumentException("variable '" + name + "' has no table");
                }
                List<String> order = parentOrder.get(name);
                Set<String> truth = new HashSet<>();
                for (int q : dag.parents(v)) {
                    truth.add(dag.name(q));
                }
                if (!truth.equals(new HashSet<>(order)) || order.size() != truth.size()) {
                    throw new IllegalArgumentException("table of '" + name + "' is over parents " + order
                            + " but the graph gives " + truth);
                }
                int[] parents = new int[order.size()];
                int[] pc = new int[order.size()];
                for (int k = 0; k < parents.length; k++) {
                    parents[k] = dag.index(order.get(k));
                    pc[k] = vars[parents[k]].cardinality();
                }
                int configs = configurations(name, pc);
                if (table.length != configs) {
                    throw new IllegalArgumentException("table of '" + name + "' has " + table.length
                            + " rows, its parents have " + configs + " configurations");
                }
                for (int c = 0; c < configs; c++) {
                    checkRow(name, c, table[c], vars[v].cardinality());
                }
                mech[v] = new DiscreteMechanism(v, parents, pc, table);
            }
            return new NodeWiseModel(dag, kindId, vars, mech, null, null, null, Optional::<CovarianceMatrix>empty);
        }

        private static void checkRow(String name, int row, double[] probs, int k) {
            if (probs.length != k) {
                throw new IllegalArgumentException("table of '" + name + "', row " + (row + 1) + ": " + probs.length
                        + " probabilities for " + k + " categories");
            }
            double sum = 0;
            for (double q : probs) {
                if (!(q >= 0)) {
                    throw new IllegalArgumentException("table of '" + name + "', row " + (row + 1)
                            + ": probability " + q + " is not a number in [0, 1]");
                }
                sum += q;
            }
            if (Math.abs(sum - 1) > 1e-9) {
                throw new IllegalArgumentException("table of '" + name + "', row " + (row + 1) + " sums to " + sum
                        + ", not 1: " + Arrays.toString(probs));
            }
        }
    }
}

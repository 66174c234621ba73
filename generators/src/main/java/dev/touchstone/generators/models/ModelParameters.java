package dev.touchstone.generators.models;

import dev.touchstone.core.data.CovarianceMatrix;
import dev.touchstone.core.data.Variable;
import dev.touchstone.core.graph.Graph;

import java.util.ArrayList;
import java.util.Arrays;
import java.util.HashSet;
import java.util.List;
import java.util.Map;
import java.util.Optional;
import java.util.Set;

/**
 * Every parameter of a drawn structural model, as plain values: the kind that drew it, the
 * DAG (hidden variables flagged), one {@link NodeParameters} per variable in graph order,
 * the observed columns in data order, and the fixed centre and scale of each standardised
 * variable (empty when the model does not standardise). {@link StructuralModel#parameters()}
 * gives them and {@link #model()} rebuilds the very same model: for a seed it samples the
 * same values bit for bit. Rebuilding checks that every mechanism names its graph parents and
 * that the sizes agree; a mistake is an {@link IllegalArgumentException} naming the variable.
 * Cost O(parameters).
 *
 * @param kind            the model kind (or reference network) id
 * @param dag             the generating DAG, hidden variables flagged
 * @param nodes           one mechanism per variable, in graph index order
 * @param columns         the observed variables in data column order
 * @param standardisation centre and scale of each standardised variable; empty for none
 */
public record ModelParameters(String kind, Graph dag, List<NodeParameters> nodes, List<String> columns,
                              Map<String, NodeParameters.Scaling> standardisation) {

    public ModelParameters {
        nodes = List.copyOf(nodes);
        columns = List.copyOf(columns);
        standardisation = Map.copyOf(standardisation);
    }

    /** The model these parameters describe. */
    public StructuralModel model() {
        int p = dag.size();
        if (nodes.size() != p) {
            throw new IllegalArgumentException(nodes.size() + " mechanisms for " + p + " variables");
        }
        Variable[] vars = new Variable[p];
        for (int v = 0; v < p; v++) {
            NodeParameters n = nodes.get(v);
            if (!n.variable().equals(dag.name(v))) {
                throw new IllegalArgumentException("mechanism " + (v + 1) + " is for '" + n.variable()
                        + "' but variable " + (v + 1) + " is '" + dag.name(v) + "'");
            }
            if (n instanceof NodeParameters.Table t) {
                vars[v] = Variable.discrete(t.variable(), t.categories());
            } else if (n instanceof NodeParameters.Logistic l) {
                vars[v] = Variable.discrete(l.variable(), l.categories());
            } else {
                vars[v] = Variable.continuous(n.variable());
            }
        }
        NodeMechanism[] mech = new NodeMechanism[p];
        boolean linear = true;
        for (int v = 0; v < p; v++) {
            mech[v] = mechanism(v, nodes.get(v), vars);
            linear &= mech[v] instanceof LinearMechanism;
        }
        Set<String> observed = new HashSet<>();
        for (int v : dag.observedIndices()) {
            observed.add(dag.name(v));
        }
        if (!observed.equals(new HashSet<>(columns)) || columns.size() != observed.size()) {
            throw new IllegalArgumentException("the columns " + columns + " are not the observed variables "
                    + observed);
        }
        double[] key = new double[p];
        Arrays.fill(key, Double.POSITIVE_INFINITY);
        for (int c = 0; c < columns.size(); c++) {
            key[dag.index(columns.get(c))] = c;
        }
        NodeWiseModel m;
        if (linear) {
            LinearMechanism[] lm = new LinearMechanism[p];
            for (int v = 0; v < p; v++) {
                lm[v] = (LinearMechanism) mech[v];
            }
            LinearModels.CovarianceHolder cov = new LinearModels.CovarianceHolder(dag, lm);
            m = new NodeWiseModel(dag, kind, vars, mech, null, null, key, () -> Optional.of(cov.get()));
        } else {
            m = new NodeWiseModel(dag, kind, vars, mech, null, null, key, Optional::<CovarianceMatrix>empty);
        }
        if (!standardisation.isEmpty()) {
            double[] centre = new double[p];
            double[] scale = new double[p];
            Arrays.fill(scale, Double.NaN);
            for (Map.Entry<String, NodeParameters.Scaling> e : standardisation.entrySet()) {
                int v = dag.indexOf(e.getKey());
                if (v < 0 || vars[v].isDiscrete()) {
                    throw new IllegalArgumentException("standardisation of '" + e.getKey()
                            + "': not a continuous variable of the model");
                }
                centre[v] = e.getValue().centre();
                scale[v] = e.getValue().scale();
            }
            m = m.withStandardisation(centre, scale);
        }
        return m;
    }

    private int[] indices(String child, List<String> parents, Set<String> seen) {
        int[] out = new int[parents.size()];
        for (int k = 0; k < out.length; k++) {
            int q = dag.indexOf(parents.get(k));
            if (q < 0) {
                throw new IllegalArgumentException("variable '" + child + "': unknown parent '" + parents.get(k) + "'");
            }
            out[k] = q;
            seen.add(parents.get(k));
        }
        return out;
    }

    private void checkParents(int v, Set<String> given, int count) {
        Set<String> truth = new HashSet<>();
        for (int q : dag.parents(v)) {
            truth.add(dag.name(q));
        }
        if (!truth.equals(given) || count != truth.size()) {
            throw new IllegalArgumentException("variable '" + dag.name(v) + "': the mechanism's parents " + given
                    + " are not its parents in the graph " + truth);
        }
    }

    private static void checkLength(String child, String what, int length, int expected) {
        if (length != expected) {
            throw new IllegalArgumentException("variable '" + child + "': " + length + " " + what + " where "
                    + expected + " are needed");
        }
    }

    private NodeMechanism mechanism(int v, NodeParameters n, Variable[] vars) {
        String name = n.variable();
        Set<String> seen = new HashSet<>();
        if (n instanceof NodeParameters.Linear l) {
            int[] pa = indices(name, l.parents(), seen);
            checkParents(v, seen, pa.length);
            checkLength(name, "weights", l.weights().length, pa.length);
            return new LinearMechanism(v, pa, l.weights(), l.noise().scale(), l.noise().distribution(),
                    l.noise().degreesOfFreedom());
        }
        if (n instanceof NodeParameters.Additive a) {
            List<String> names = new ArrayList<>();
            double[] mean = new double[a.inputs().size()];
            double[] sd = new double[mean.length];
            for (int k = 0; k < mean.length; k++) {
                names.add(a.inputs().get(k).parent());
                mean[k] = a.inputs().get(k).scaling().centre();
                sd[k] = a.inputs().get(k).scaling().scale();
            }
            int[] pa = indices(name, names, seen);
            checkParents(v, seen, pa.length);
            return new NonlinearMechanism(v, pa, mean, sd, a.function(), a.output().centre(), a.output().scale(),
                    a.noiseScale());
        }
        if (n instanceof NodeParameters.Table t) {
            int[] pa = indices(name, t.parents(), seen);
            checkParents(v, seen, pa.length);
            int[] pc = new int[pa.length];
            for (int k = 0; k < pa.length; k++) {
                if (!vars[pa[k]].isDiscrete()) {
                    throw new IllegalArgumentException("variable '" + name + "': parent '" + t.parents().get(k)
                            + "' of a table must be discrete");
                }
                pc[k] = vars[pa[k]].cardinality();
            }
            checkLength(name, "table rows", t.probabilities().length, DiscreteNetworkModel.configurations(name, pc));
            for (double[] row : t.probabilities()) {
                checkLength(name, "probabilities in a row", row.length, t.categories().size());
            }
            return new DiscreteMechanism(v, pa, pc, t.probabilities());
        }
        if (n instanceof NodeParameters.ConditionalGaussian g) {
            List<String> con = new ArrayList<>();
            double[] mean = new double[g.continuousParents().size()];
            double[] sd = new double[mean.length];
            double[] w = new double[mean.length];
            for (int k = 0; k < mean.length; k++) {
                NodeParameters.Slope s = g.continuousParents().get(k);
                con.add(s.parent());
                mean[k] = s.scaling().centre();
                sd[k] = s.scaling().scale();
                checkLength(name, "weights of '" + s.parent() + "'", s.values().length, 1);
                w[k] = s.values()[0];
            }
            List<String> dis = new ArrayList<>();
            double[][] shifts = new double[g.discreteParents().size()][];
            for (int k = 0; k < shifts.length; k++) {
                dis.add(g.discreteParents().get(k).parent());
                shifts[k] = g.discreteParents().get(k).byCategory();
            }
            int[] cp = indices(name, con, seen);
            int[] dp = indices(name, dis, seen);
            checkParents(v, seen, cp.length + dp.length);
            for (int k = 0; k < dp.length; k++) {
                checkLength(name, "shifts of '" + dis.get(k) + "'", shifts[k].length, vars[dp[k]].cardinality());
            }
            return new MixedMechanisms.Continuous(v, new MixedMechanisms.Standardised(cp, mean, sd), w,
                    new MixedMechanisms.Shifts(dp, shifts), new MixedMechanisms.Noise(g.intercept(), g.noiseScale()));
        }
        NodeParameters.Logistic l = (NodeParameters.Logistic) n;
        int categories = l.categories().size();
        int[] dp = indices(name, l.discreteParents(), seen);
        List<String> con = new ArrayList<>();
        double[] mean = new double[l.slopes().size()];
        double[] sd = new double[mean.length];
        double[][] beta = new double[categories][mean.length];
        for (int k = 0; k < mean.length; k++) {
            NodeParameters.Slope s = l.slopes().get(k);
            con.add(s.parent());
            mean[k] = s.scaling().centre();
            sd[k] = s.scaling().scale();
            checkLength(name, "slopes of '" + s.parent() + "'", s.values().length, categories);
            for (int c = 0; c < categories; c++) {
                beta[c][k] = s.values()[c];
            }
        }
        int[] cp = indices(name, con, seen);
        checkParents(v, seen, cp.length + dp.length);
        int[] strides = new int[dp.length];
        int stride = 1;
        for (int k = dp.length - 1; k >= 0; k--) {
            strides[k] = stride;
            stride *= vars[dp[k]].cardinality();
        }
        checkLength(name, "rows of log-intercepts", l.logIntercepts().length, stride);
        for (double[] row : l.logIntercepts()) {
            checkLength(name, "log-intercepts in a row", row.length, categories);
        }
        return new MixedMechanisms.Discrete(v, categories,
                new MixedMechanisms.Intercepts(dp, strides, l.logIntercepts()),
                new MixedMechanisms.Standardised(cp, mean, sd), beta);
    }
}

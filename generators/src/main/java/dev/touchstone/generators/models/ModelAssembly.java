package dev.touchstone.generators.models;

import dev.touchstone.core.data.CovarianceMatrix;
import dev.touchstone.core.data.Variable;
import dev.touchstone.core.graph.Graph;

import java.util.Arrays;
import java.util.List;
import java.util.Optional;

/**
 * Assembles a structural model from parameters given one variable at a time (for example
 * parameters fitted to data), in the conditional Gaussian family of Lauritzen and Wermuth
 * (1989, "Graphical models for associations between variables, some of which are
 * qualitative and some quantitative", Annals of Statistics 17): a continuous variable is
 * an intercept plus linear effects of its continuous parents plus a shift per category of
 * each discrete parent plus Gaussian noise (so linear Gaussian models are the special case
 * with no discrete parents); a discrete variable follows a multinomial logistic link whose
 * intercepts depend on the configuration of its discrete parents and whose slopes act on
 * its standardised continuous parents (with no continuous parent this is a plain
 * conditional table). Sampling costs O(rows · (p + edges) · categories).
 */
public final class ModelAssembly {

    private ModelAssembly() {
    }

    /** A builder over this DAG; every variable needs exactly one mechanism over its DAG parents. */
    public static Builder builder(Graph dag) {
        return new Builder(dag);
    }

    /** Collects one mechanism per variable. */
    public static final class Builder {
        private final Graph dag;
        private final Variable[] variables;
        private final NodeMechanism[] mechanisms;

        private Builder(Graph dag) {
            this.dag = dag;
            this.variables = new Variable[dag.size()];
            this.mechanisms = new NodeMechanism[dag.size()];
        }

        /**
         * A continuous variable: intercept + Σ weights[k]·X[continuousParents[k]] +
         * Σ shifts[k][code of discreteParents[k]] + noiseSd·ε with standard normal ε.
         */
        public Builder gaussian(String name, double intercept, List<String> continuousParents, double[] weights,
                                List<String> discreteParents, double[][] shifts, double noiseSd) {
            int v = dag.index(name);
            checkParents(v, continuousParents, discreteParents);
            if (weights.length != continuousParents.size() || shifts.length != discreteParents.size()) {
                throw new IllegalArgumentException("variable '" + name + "': one weight per continuous parent and"
                        + " one shift list per discrete parent are needed");
            }
            if (!(noiseSd >= 0) || !Double.isFinite(noiseSd)) {
                throw new IllegalArgumentException("variable '" + name + "': noise scale " + noiseSd
                        + " is not a finite non-negative number");
            }
            variables[v] = Variable.continuous(name);
            double[][] s = new double[shifts.length][];
            for (int k = 0; k < s.length; k++) {
                s[k] = shifts[k].clone();
            }
            mechanisms[v] = new MixedMechanisms.Continuous(v,
                    MixedMechanisms.Standardised.asIs(indices(continuousParents)), weights.clone(),
                    new MixedMechanisms.Shifts(indices(discreteParents), s),
                    new MixedMechanisms.Noise(intercept, noiseSd));
            return this;
        }

        /**
         * A discrete variable with these categories: log-odds of category c are
         * logIntercepts[config][c] + Σ_k slopes[c][k]·(X[continuousParents[k]] − centre[k]) / scale[k],
         * where config is the configuration of the discrete parents (last parent fastest).
         * With no continuous parents, {@code logIntercepts} holds the log of a conditional table.
         */
        public Builder categorical(String name, List<String> categories, List<String> discreteParents,
                                   double[][] logIntercepts, List<String> continuousParents, double[] centre,
                                   double[] scale, double[][] slopes) {
            int v = dag.index(name);
            checkParents(v, continuousParents, discreteParents);
            variables[v] = Variable.discrete(name, categories);
            int[] dp = indices(discreteParents);
            int[] strides = new int[dp.length];
            int stride = 1;
            for (int k = dp.length - 1; k >= 0; k--) {
                if (variables[dp[k]] == null || !variables[dp[k]].isDiscrete()) {
                    throw new IllegalArgumentException("variable '" + name + "': discrete parent '"
                            + discreteParents.get(k) + "' must be declared discrete first");
                }
                strides[k] = stride;
                stride *= variables[dp[k]].cardinality();
            }
            if (logIntercepts.length != stride) {
                throw new IllegalArgumentException("variable '" + name + "': " + logIntercepts.length
                        + " rows of intercepts for " + stride + " parent configurations");
            }
            double[][] a = new double[stride][];
            for (int c = 0; c < stride; c++) {
                if (logIntercepts[c].length != categories.size()) {
                    throw new IllegalArgumentException("variable '" + name + "': row " + (c + 1) + " has "
                            + logIntercepts[c].length + " values for " + categories.size() + " categories");
                }
                a[c] = logIntercepts[c].clone();
            }
            double[][] b = new double[categories.size()][];
            for (int c = 0; c < b.length; c++) {
                b[c] = slopes[c].clone();
            }
            mechanisms[v] = new MixedMechanisms.Discrete(v, categories.size(),
                    new MixedMechanisms.Intercepts(dp, strides, a),
                    new MixedMechanisms.Standardised(indices(continuousParents), centre.clone(), scale.clone()), b);
            return this;
        }

        private void checkParents(int v, List<String> continuous, List<String> discrete) {
            int[] truth = dag.parents(v).clone();
            int[] given = new int[continuous.size() + discrete.size()];
            int i = 0;
            for (String s : continuous) {
                given[i++] = dag.index(s);
            }
            for (String s : discrete) {
                given[i++] = dag.index(s);
            }
            Arrays.sort(truth);
            Arrays.sort(given);
            if (!Arrays.equals(truth, given)) {
                throw new IllegalArgumentException("variable '" + dag.name(v) + "': the parents given are not"
                        + " its parents in the graph");
            }
        }

        private int[] indices(List<String> names) {
            int[] out = new int[names.size()];
            for (int k = 0; k < out.length; k++) {
                out[k] = dag.index(names.get(k));
            }
            return out;
        }

        /** The model under the id {@code kindId}; columns in graph order, no standardisation. */
        public StructuralModel build(String kindId) {
            for (int v = 0; v < mechanisms.length; v++) {
                if (mechanisms[v] == null) {
                    throw new IllegalArgumentException("variable '" + dag.name(v) + "' has no mechanism");
                }
            }
            return new NodeWiseModel(dag, kindId, variables.clone(), mechanisms.clone(), null, null, null,
                    Optional::<CovarianceMatrix>empty);
        }
    }
}

package dev.touchstone.generators.models;

import dev.touchstone.core.data.CovarianceMatrix;
import dev.touchstone.core.data.Variable;
import dev.touchstone.core.graph.Graph;
import dev.touchstone.core.graph.algorithms.Ancestry;
import dev.touchstone.core.param.ParameterValues;
import org.apache.commons.rng.UniformRandomProvider;

import java.util.Optional;

/**
 * Drawing linear structural-equation models X = BX + E (common practice; e.g. Kalisch and
 * Bühlmann 2007; Reisach, Seiler and Weichwald 2021), shared by the Gaussian and
 * non-Gaussian kinds. The exact covariance Σ = (I − B)⁻¹ Ω (I − B)⁻ᵀ is computed by the
 * recursion Σ_vu = Σ_k B_vk Σ_ku along a topological order, which costs O(p² · mean
 * in-degree) and is done lazily, once per model.
 */
final class LinearModels {

    /** Above this many variables, standardisation uses pilot moments, not the exact covariance. */
    static final int EXACT_STANDARDISATION_LIMIT = 2000;

    private LinearModels() {
    }

    static NodeWiseModel draw(String kindId, Graph dag, ParameterValues values, NoiseDistribution noise,
                              double degreesOfFreedom, UniformRandomProvider random) {
        ModelOptions.WeightDraw weights = ModelOptions.weights(values);
        ModelOptions.WeightDraw scales = ModelOptions.noiseScales(values);
        int p = dag.size();
        Variable[] vars = new Variable[p];
        LinearMechanism[] mech = new LinearMechanism[p];
        for (int v = 0; v < p; v++) {
            vars[v] = Variable.continuous(dag.name(v));
            int[] parents = dag.parents(v);
            double[] w = new double[parents.length];
            for (int k = 0; k < parents.length; k++) {
                w[k] = weights.draw(random);
            }
            mech[v] = new LinearMechanism(v, parents, w, scales.draw(random), noise, degreesOfFreedom);
        }
        CovarianceHolder cov = new CovarianceHolder(dag, mech);
        NodeWiseModel raw = new NodeWiseModel(dag, kindId, vars, mech, null, null, null,
                () -> Optional.of(cov.get()));
        double[] exactVariance = null;
        if (ModelOptions.isSet(values, ModelOptions.STANDARDIZE) && p <= EXACT_STANDARDISATION_LIMIT) {
            CovarianceMatrix s = cov.get();
            exactVariance = new double[p];
            for (int v = 0; v < p; v++) {
                exactVariance[v] = s.get(v, v);
            }
        }
        return ModelOptions.apply(raw, values, exactVariance, random);
    }

    /** Σ over all variables, in graph index order, computed on first use. */
    static final class CovarianceHolder {
        private final Graph dag;
        private final LinearMechanism[] mech;
        private volatile CovarianceMatrix value;

        CovarianceHolder(Graph dag, LinearMechanism[] mech) {
            this.dag = dag;
            this.mech = mech;
        }

        CovarianceMatrix get() {
            CovarianceMatrix v = value;
            if (v == null) {
                synchronized (this) {
                    if (value == null) {
                        value = compute();
                    }
                    v = value;
                }
            }
            return v;
        }

        private CovarianceMatrix compute() {
            int p = dag.size();
            double[] s = new double[p * p];
            int[] topo = Ancestry.topologicalOrder(dag);
            int[] done = new int[p];
            int count = 0;
            for (int v : topo) {
                int[] pa = mech[v].parents();
                double[] w = mech[v].weights();
                for (int i = 0; i < count; i++) {
                    int u = done[i];
                    double acc = 0;
                    for (int k = 0; k < pa.length; k++) {
                        acc += w[k] * s[pa[k] * p + u];
                    }
                    s[v * p + u] = acc;
                    s[u * p + v] = acc;
                }
                double var = mech[v].noiseScale() * mech[v].noiseScale();
                for (int k = 0; k < pa.length; k++) {
                    var += w[k] * s[v * p + pa[k]];
                }
                s[v * p + v] = var;
                done[count++] = v;
            }
            return CovarianceMatrix.of(dag.names(), s, CovarianceMatrix.INFINITE_SAMPLE);
        }
    }
}

package dev.touchstone.generators.models;

import dev.touchstone.core.data.CovarianceMatrix;
import dev.touchstone.core.data.Variable;
import dev.touchstone.core.graph.Graph;
import dev.touchstone.core.graph.algorithms.Ancestry;
import dev.touchstone.core.param.ParameterValues;
import org.apache.commons.rng.UniformRandomProvider;
import org.apache.commons.rng.sampling.distribution.DirichletSampler;

import java.util.ArrayList;
import java.util.List;
import java.util.Optional;

/** Drawing conditional Gaussian models (see {@link ConditionalGaussianKind}); cost O(p · pilot rows · parents). */
final class MixedModels {

    private MixedModels() {
    }

    static StructuralModel draw(String kindId, Graph dag, ParameterValues values, UniformRandomProvider random) {
        double fraction = values.getDouble(ConditionalGaussianKind.DISCRETE_FRACTION.name());
        int low = values.getInt(DiscreteNetworkKind.CARDINALITY_LOW.name());
        int high = values.getInt(DiscreteNetworkKind.CARDINALITY_HIGH.name());
        ModelOptions.checkRange(DiscreteNetworkKind.CARDINALITY_LOW.name(), low,
                DiscreteNetworkKind.CARDINALITY_HIGH.name(), high);
        double alpha = values.getDouble(DiscreteNetworkKind.CONCENTRATION.name());
        ModelOptions.WeightDraw weights = ModelOptions.weights(values);
        ModelOptions.WeightDraw scales = ModelOptions.noiseScales(values);
        int p = dag.size();
        String[] names = dag.names().toArray(new String[0]);
        Variable[] vars = new Variable[p];
        int[] card = new int[p];
        for (int v = 0; v < p; v++) {
            if (random.nextDouble() < fraction) {
                card[v] = low + random.nextInt(high - low + 1);
                vars[v] = Variable.discrete(names[v], card[v]);
            } else {
                vars[v] = Variable.continuous(names[v]);
            }
        }
        NodeMechanism[] mech = new NodeMechanism[p];
        Pilot pilot = new Pilot(names, random.nextLong());
        for (int v : Ancestry.topologicalOrder(dag)) {
            List<Integer> dis = new ArrayList<>();
            List<Integer> con = new ArrayList<>();
            for (int q : dag.parents(v)) {
                (card[q] > 0 ? dis : con).add(q);
            }
            int[] dp = dis.stream().mapToInt(Integer::intValue).toArray();
            int[] cp = con.stream().mapToInt(Integer::intValue).toArray();
            double[] pm = new double[cp.length];
            double[] ps = new double[cp.length];
            for (int k = 0; k < cp.length; k++) {
                pm[k] = pilot.mean(cp[k]);
                ps[k] = pilot.sd(cp[k]);
            }
            NodeMechanism m;
            if (card[v] == 0) {
                double[] w = new double[cp.length];
                for (int k = 0; k < cp.length; k++) {
                    w[k] = weights.draw(random);
                }
                double[][] shifts = new double[dp.length][];
                for (int k = 0; k < dp.length; k++) {
                    shifts[k] = new double[card[dp[k]]];
                    for (int c = 1; c < shifts[k].length; c++) {
                        shifts[k][c] = weights.draw(random);
                    }
                }
                m = new MixedMechanisms.Continuous(v, new MixedMechanisms.Standardised(cp, pm, ps), w,
                        new MixedMechanisms.Shifts(dp, shifts), new MixedMechanisms.Noise(0.0, scales.draw(random)));
            } else {
                int[] pc = new int[dp.length];
                for (int k = 0; k < dp.length; k++) {
                    pc[k] = card[dp[k]];
                }
                int configs = DiscreteNetworkModel.configurations(names[v], pc);
                int[] strides = new int[dp.length];
                int stride = 1;
                for (int k = dp.length - 1; k >= 0; k--) {
                    strides[k] = stride;
                    stride *= pc[k];
                }
                DirichletSampler dirichlet = DirichletSampler.symmetric(random, card[v], alpha);
                double[][] a = new double[configs][];
                for (int c = 0; c < configs; c++) {
                    double[] pi = dirichlet.sample();
                    a[c] = new double[card[v]];
                    for (int j = 0; j < card[v]; j++) {
                        a[c][j] = Math.log(Math.max(pi[j], 1e-300));
                    }
                }
                double[][] beta = new double[card[v]][cp.length];
                for (int c = 1; c < card[v]; c++) {
                    for (int k = 0; k < cp.length; k++) {
                        beta[c][k] = weights.draw(random);
                    }
                }
                m = new MixedMechanisms.Discrete(v, card[v], new MixedMechanisms.Intercepts(dp, strides, a),
                        new MixedMechanisms.Standardised(cp, pm, ps), beta);
            }
            mech[v] = m;
            pilot.add(v, m);
        }
        NodeWiseModel raw = new NodeWiseModel(dag, kindId, vars, mech, null, null, null,
                Optional::<CovarianceMatrix>empty);
        return ModelOptions.apply(raw, values, null, random);
    }
}

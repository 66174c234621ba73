package dev.touchstone.generators.models;

import dev.touchstone.core.data.CovarianceMatrix;
import dev.touchstone.core.data.Variable;
import dev.touchstone.core.graph.Graph;
import dev.touchstone.core.graph.algorithms.Ancestry;
import dev.touchstone.core.param.ParameterValues;
import org.apache.commons.rng.UniformRandomProvider;

import java.util.List;
import java.util.Optional;

/** Drawing additive nonlinear models (see {@link AdditiveNonlinearKind}); cost O(p · pilot rows · f). */
final class NonlinearModels {

    private static final List<String> CLASSES = List.of("sigmoid", "polynomial", "neural-net", "fourier");

    private NonlinearModels() {
    }

    static StructuralModel draw(String kindId, Graph dag, ParameterValues values, UniformRandomProvider random) {
        String functions = values.getString(AdditiveNonlinearKind.FUNCTIONS.name());
        ModelOptions.WeightDraw scales = ModelOptions.noiseScales(values);
        int p = dag.size();
        Variable[] vars = new Variable[p];
        String[] names = dag.names().toArray(new String[0]);
        NodeMechanism[] mech = new NodeMechanism[p];
        Pilot pilot = new Pilot(names, random.nextLong());
        for (int v : Ancestry.topologicalOrder(dag)) {
            vars[v] = Variable.continuous(names[v]);
            int[] parents = dag.parents(v);
            double[] pm = new double[parents.length];
            double[] ps = new double[parents.length];
            for (int k = 0; k < parents.length; k++) {
                pm[k] = pilot.mean(parents[k]);
                ps[k] = pilot.sd(parents[k]);
            }
            String kind = functions.equals("mixed") ? CLASSES.get(random.nextInt(CLASSES.size())) : functions;
            NodeFunction f = parents.length == 0 ? new NodeFunction.None() : NodeFunction.draw(kind, parents.length, values, random);
            NonlinearMechanism m = new NonlinearMechanism(v, parents, pm, ps, f, 0.0, 1.0, scales.draw(random));
            if (parents.length > 0) {
                double[] mom = Moments.of(m.signal(pilot.columns(), ModelOptions.PILOT_ROWS), ModelOptions.PILOT_ROWS);
                m = m.normalised(mom[0], mom[1]);
            }
            mech[v] = m;
            pilot.add(v, m);
        }
        NodeWiseModel raw = new NodeWiseModel(dag, kindId, vars, mech, null, null, null,
                Optional::<CovarianceMatrix>empty);
        return ModelOptions.apply(raw, values, null, random);
    }
}

package dev.touchstone.generators;

import dev.touchstone.core.graph.Graph;
import dev.touchstone.core.knowledge.Knowledge;
import dev.touchstone.generators.missing.MissingnessDriver;
import dev.touchstone.generators.missing.MissingnessPlan;
import dev.touchstone.generators.models.ModelParameters;

import java.util.ArrayList;
import java.util.List;

/**
 * Everything that fixes one replicate's truth, as plain values: the model's parameters
 * (graph, mechanisms, standardisation, column order), the missingness of each affected
 * variable, the tiers the graph family implied, and the seeds. {@link SimulatedTruth#parameters()}
 * gives them and {@link #truth()} rebuilds a truth that samples the same data for the same
 * data seed. Cost O(parameters).
 *
 * @param seed        the replicate seed the truth was drawn from
 * @param dataSeed    the seed its data are drawn with
 * @param model       the model's parameters
 * @param missingness one driver per variable with missing cells (empty for none)
 * @param tiers       the tiers over observed variables (empty for none)
 */
public record TruthParameters(long seed, long dataSeed, ModelParameters model, List<MissingnessDriver> missingness,
                              List<List<String>> tiers) {

    public TruthParameters {
        missingness = List.copyOf(missingness);
        List<List<String>> t = new ArrayList<>();
        for (List<String> tier : tiers) {
            t.add(List.copyOf(tier));
        }
        tiers = List.copyOf(t);
    }

    /** The truth these parameters describe, drawing its data with {@link #dataSeed()}. */
    public SimulatedTruth truth() {
        return truth(dataSeed);
    }

    /** The same truth drawing its data with another seed (new data from the same model). */
    public SimulatedTruth truth(long withDataSeed) {
        Graph dag = model.dag();
        Knowledge.Builder k = Knowledge.builder();
        for (List<String> tier : tiers) {
            k.tier(tier);
        }
        List<String> order = Simulation.topologicalNames(dag);
        for (MissingnessDriver d : missingness) {
            if (dag.indexOf(d.variable()) < 0 || (d.driver() != null && dag.indexOf(d.driver()) < 0)) {
                throw new IllegalArgumentException("missingness of '" + d.variable() + "': not a variable of the model"
                        + (d.driver() == null ? "" : ", or its driver '" + d.driver() + "' is not"));
            }
        }
        return new SimulatedTruth(seed, dag, tiers.isEmpty() ? Knowledge.none() : k.build(), order, model.model(),
                new MissingnessPlan(missingness), withDataSeed);
    }
}

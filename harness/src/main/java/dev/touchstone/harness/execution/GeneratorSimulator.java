package dev.touchstone.harness.execution;

import dev.touchstone.core.knowledge.Knowledge;
import dev.touchstone.generators.SimulatedTruth;
import dev.touchstone.harness.study.GeneratorTruthCatalog;
import dev.touchstone.harness.study.ReplicateSeeds;
import dev.touchstone.harness.study.TruthSetting;

/**
 * The simulator over the generators: builds the setting's {@code Simulation}, draws the
 * replicate's truth from {@link ReplicateSeeds#replicateSeed()} and one data set of the
 * largest sample size (smaller ones are its prefixes). Thread-safe; cost: the generators'.
 */
public final class GeneratorSimulator implements Simulator {

    @Override
    public Replicate draw(TruthSetting truth, ReplicateSeeds seeds, int rows) {
        return replicate(truth(truth, seeds), rows);
    }

    /** The replicate's truth: graph, hidden flags, model parameters and missingness. */
    public static SimulatedTruth truth(TruthSetting truth, ReplicateSeeds seeds) {
        return GeneratorTruthCatalog.simulation(truth).drawTruth(seeds.replicateSeed());
    }

    /** A drawn truth with {@code rows} rows of its data (none for 0). */
    public static Replicate replicate(SimulatedTruth t, int rows) {
        return Replicate.withLazyCovariance(t.dag(), rows > 0 ? t.sample(rows).data() : null,
                () -> t.populationCovariance().orElse(null), tiersOnly(t.knowledge()));
    }

    /** The tiers of the truth's knowledge (what {@code knowledge: tiers} hands to runs). */
    static Knowledge tiersOnly(Knowledge k) {
        if (k.tiers().isEmpty()) {
            return Knowledge.none();
        }
        Knowledge.Builder b = Knowledge.builder();
        for (java.util.List<String> tier : k.tiers()) {
            if (!tier.isEmpty()) {
                b.tier(tier);
            }
        }
        return b.build();
    }
}

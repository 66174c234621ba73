package dev.touchstone.harness.study;

import dev.touchstone.core.random.Seeds;

/**
 * The seeds of one replicate, each derived from the study seed and the coordinates of what
 * it is for (Seeds.derive), never from order of execution.
 *
 * <p>A section's seed depends only on that section and the ones before it, so, for
 * example, the same graph parameters and replicate give the same graph under every model,
 * hidden-variable and missing-value choice: comparisons across those axes are paired too.
 */
public record ReplicateSeeds(long studySeed, TruthSetting truth, int replicate) {

    /**
     * The one seed a whole replicate is drawn from by the generators (which derive graph,
     * hidden, model, missingness and data streams from it by purpose). It depends on the
     * study seed, the first truth section (the graph) and the replicate number only, so
     * settings that differ in model, hidden or missing options share the replicate's graph
     * (common random numbers: comparisons across those axes are paired too).
     */
    public long replicateSeed() {
        return Seeds.derive(studySeed, "replicate", truth.canonicalUpTo(1), replicate);
    }

    /** The seed of a truth section's random draw (for simulators that seed each section separately). */
    public long section(String name) {
        int upTo = -1;
        for (int i = 0; i < truth.choices().size(); i++) {
            if (truth.choices().get(i).section().equals(name)) {
                upTo = i + 1;
            }
        }
        if (upTo < 0) {
            throw new IllegalArgumentException("no truth section '" + name + "'");
        }
        return Seeds.derive(studySeed, "truth", name, truth.canonicalUpTo(upTo), replicate);
    }

    /** The seed of the data draw (one draw of the largest sample size; smaller ones are its prefixes). */
    public long data() {
        return Seeds.derive(studySeed, "data", truth.canonical(), replicate);
    }
}

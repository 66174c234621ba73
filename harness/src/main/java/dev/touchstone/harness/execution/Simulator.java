package dev.touchstone.harness.execution;

import dev.touchstone.harness.study.ReplicateSeeds;
import dev.touchstone.harness.study.TruthSetting;

/**
 * Draws one replicate of a truth setting: graph, model parameters, hidden variables, data
 * and missing cells, each from its own seed. Implemented over the generators; must be
 * deterministic for given seeds and thread-safe.
 */
public interface Simulator {

    /**
     * @param truth the truth setting
     * @param seeds the replicate's seeds
     * @param rows  the number of rows to draw (the study's largest finite sample size), 0 for none
     */
    Replicate draw(TruthSetting truth, ReplicateSeeds seeds, int rows);
}

package dev.touchstone.core.learner;

import java.util.Locale;

/** A kind of background knowledge a learner can honour. */
public enum KnowledgeUse {
    REQUIRED_EDGES,
    FORBIDDEN_EDGES,
    TIERS;

    public String word() {
        return name().toLowerCase(Locale.ROOT).replace('_', '-');
    }
}

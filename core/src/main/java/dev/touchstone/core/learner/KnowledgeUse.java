package dev.touchstone.core.learner;

import dev.touchstone.core.param.Worded;

/** A kind of background knowledge a learner can honour. */
public enum KnowledgeUse implements Worded {
    REQUIRED_EDGES,
    FORBIDDEN_EDGES,
    TIERS
}

package dev.touchstone.learners.constraint;

import dev.touchstone.core.param.Worded;

/**
 * What PC does when two colliders want arrowheads at both ends of one edge (x → z ← y and
 * z → w ← v both orient z − w), which happens only with errors in the tests. A declared
 * choice, since published versions differ (Colombo and Maathuis 2014, §4.3 discuss both).
 */
public enum ConflictRule implements Worded {
    /**
     * Colliders are oriented one by one in the order of (z, x, y) positions; a collider is
     * skipped when one of its edges already points away from z, or the knowledge forbids an
     * arrowhead it needs. The result depends on the order of the variables.
     */
    KEEP_FIRST,
    /**
     * All colliders are collected first; an edge that would get arrowheads at both ends gets
     * neither and stays undirected, every other arrowhead is placed. The result does not
     * depend on the order of the variables.
     */
    DROP_BOTH
}

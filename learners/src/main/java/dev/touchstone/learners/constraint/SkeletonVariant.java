package dev.touchstone.learners.constraint;

import dev.touchstone.core.param.Worded;

/** How the adjacency search of PC and FCI visits pairs. */
public enum SkeletonVariant implements Worded {
    /**
     * The sequential search, PC's adjacency step as first published (Spirtes, Glymour and
     * Scheines 2000, §5.4.2): pairs are visited in variable order and an edge removed is gone at once, so later tests of
     * the same level condition on the thinned neighbourhoods. The result can depend on the
     * order of the variables.
     */
    SEQUENTIAL,
    /**
     * The order-independent ("stable") search of Colombo and Maathuis (2014,
     * "Order-independent constraint-based causal structure learning", JMLR 15): the
     * neighbourhoods are frozen at the start of each level, so the level's tests do not
     * depend on each other and run in parallel; the skeleton does not depend on the order of
     * the variables.
     */
    ORDER_INDEPENDENT
}

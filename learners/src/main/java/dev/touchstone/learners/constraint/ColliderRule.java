package dev.touchstone.learners.constraint;

import dev.touchstone.core.param.Worded;

/** How PC decides whether an unshielded triple x − z − y is a collider x → z ← y. */
public enum ColliderRule implements Worded {
    /**
     * A collider exactly when z is not in the separating set the adjacency search recorded
     * for x and y (Spirtes, Glymour and Scheines 2000, §5.4.2).
     */
    SEPSET,
    /**
     * Conservative (Ramsey, Zhang and Spirtes 2006, "Adjacency-faithfulness and conservative
     * causal inference", UAI): every subset of the neighbours of x and of y in the final
     * skeleton is tested; a collider when z is in none of the separating sets, a
     * non-collider when it is in all, ambiguous (left unoriented) otherwise.
     */
    CONSERVATIVE,
    /**
     * Majority rule (Colombo and Maathuis 2014, §4.2): the same separating sets as the
     * conservative rule; a collider when z is in fewer than half of them, a non-collider
     * when in more than half, ambiguous at exactly half.
     */
    MAJORITY
}

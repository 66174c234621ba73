/**
 * Hybrid learners, which combine a constraint-based and a score-based search: GFCI (GES's
 * adjacencies and colliders, then FCI's tests and rules) and MMHC (max-min parents and children,
 * then hill climbing restricted to that skeleton). Each runs the existing learners of the other
 * packages through their public interfaces rather than copying their searches.
 */
package dev.touchstone.learners.hybrid;

/**
 * Learners made of steps of other learners: each step after the first receives the estimate
 * of the step before as allowed edges, required edges or a starting graph.
 */
package dev.touchstone.learners.composed;

/** Constraint-based learners: the PC family and FCI, with their shared adjacency search, collider orientation and background knowledge. */
package dev.touchstone.learners.constraint;


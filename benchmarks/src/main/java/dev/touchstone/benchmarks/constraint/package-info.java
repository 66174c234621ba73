/** JMH benchmarks of the constraint-based learners: one Fisher z test, and whole PC runs as p and n grow. */
package dev.touchstone.benchmarks.constraint;

/** Baselines that reveal when a benchmark is too easy: the empty graph, a random DAG, and the variance- and R²-sorting baselines. */
package dev.touchstone.learners.baseline;


/** Paired comparisons of learner configurations with a reference on identical data sets: differences, Wilcoxon signed-rank tests, Holm adjustment, wins and losses. */
package dev.touchstone.metrics.compare;

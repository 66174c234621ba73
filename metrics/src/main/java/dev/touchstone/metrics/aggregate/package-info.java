/** Summaries of each metric over the replicates of a setting and learner configuration: counts, mean, spread, bootstrap interval, quartiles. */
package dev.touchstone.metrics.aggregate;

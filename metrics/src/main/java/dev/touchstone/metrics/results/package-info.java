/** Immutable, tidy records of what came out of a study: runs, aggregates, paired comparisons and rankings. */
package dev.touchstone.metrics.results;

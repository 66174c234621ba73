/** Metrics measured against the truth of a requested class ({@code METRIC_vs_CLASS}, a study's {@code score_against}) and how their names resolve. */
package dev.touchstone.metrics.against;

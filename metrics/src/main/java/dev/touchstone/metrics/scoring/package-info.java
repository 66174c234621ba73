/** Metrics comparing an estimated graph with the truth, each defined exactly (definitions in docs/dev/metrics.md), and the registry of all metric names. */
package dev.touchstone.metrics.scoring;

/** Metrics comparing an estimated graph with the truth, each defined exactly (design §8), and the registry of all metric names. */
package dev.touchstone.metrics.scoring;

/** Benchmarks of the data layer: the covariance matrix against the naive loop and the cost of touching the data once. */
package dev.touchstone.benchmarks.data;

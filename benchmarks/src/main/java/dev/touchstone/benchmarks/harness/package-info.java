/** Benchmarks of the study runner: overhead per run, journaling, simulation and scoring. */
package dev.touchstone.benchmarks.harness;

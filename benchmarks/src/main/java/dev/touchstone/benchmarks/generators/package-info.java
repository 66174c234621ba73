/** JMH benchmarks of data generation, each against the irreducible part of its own work. */
package dev.touchstone.benchmarks.generators;

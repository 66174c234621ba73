/** JMH benchmarks of scoring: structural metrics on large sparse graphs and the structural intervention distance as p grows. */
package dev.touchstone.benchmarks.metrics;

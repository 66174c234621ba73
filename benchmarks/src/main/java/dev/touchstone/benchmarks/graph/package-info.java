/** JMH benchmarks of the graph algorithms in core (latent projection, PAG construction). */
package dev.touchstone.benchmarks.graph;

/** Random and given DAG families, each declaring its parameters, with the causal order hidden behind a random permutation of the names. */
package dev.touchstone.generators.graphs;

/** Choosing the truth an estimate is scored against: the generating DAG or its CPDAG, MAG or PAG, by default the graph of the estimate's own class. */
package dev.touchstone.metrics.truth;

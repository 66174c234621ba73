/** Choosing the truth an estimate is scored against: the generating DAG or its CPDAG, MAG or PAG (design §3). */
package dev.touchstone.metrics.truth;

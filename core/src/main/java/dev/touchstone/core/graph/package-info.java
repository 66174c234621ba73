/** Mixed graphs with endpoint marks (DAG, CPDAG, MAG, PAG) as immutable values and a mutable form for algorithms. */
package dev.touchstone.core.graph;

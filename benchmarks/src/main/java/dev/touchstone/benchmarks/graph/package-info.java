/** JMH benchmarks of the DAG and CPDAG algorithms of core (d-separation, DAG to CPDAG, Meek's rules, DAG extension). */
package dev.touchstone.benchmarks.graph;

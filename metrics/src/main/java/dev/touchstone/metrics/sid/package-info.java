/** The structural intervention distance of Peters and Bühlmann (2015) between a true DAG and an estimated DAG or CPDAG. */
package dev.touchstone.metrics.sid;

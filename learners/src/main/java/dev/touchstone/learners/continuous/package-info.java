/** Learners that find a DAG by continuous optimisation of a weight matrix under a smooth acyclicity constraint: NOTEARS. */
package dev.touchstone.learners.continuous;

/** Functional causal-model learners that identify the whole DAG from non-Gaussian noise: DirectLiNGAM. */
package dev.touchstone.learners.functional;

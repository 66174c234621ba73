/**
 * Functional causal-model learners that identify the whole DAG from the form of the equations:
 * DirectLiNGAM (non-Gaussian noise), RESIT (additive noise) and CAM (causal additive models),
 * with CAM's penalised-spline additive regression.
 */
package dev.touchstone.learners.functional;

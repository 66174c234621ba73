/** Structural-equation models (linear, non-Gaussian, additive nonlinear, discrete, conditional Gaussian) drawn for a DAG and sampled with per-variable random streams. */
package dev.touchstone.generators.models;

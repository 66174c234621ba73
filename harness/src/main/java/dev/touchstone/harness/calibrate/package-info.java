/** Calibration of learners to one real data set: truths fitted to it and perturbed, simulated replicates at several sizes, a bootstrap of the data, and the summary the report shows. */
package dev.touchstone.harness.calibrate;

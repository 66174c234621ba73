/** Audits of simulated data for known artefacts, such as variance and R² sortability. */
package dev.touchstone.generators.audit;

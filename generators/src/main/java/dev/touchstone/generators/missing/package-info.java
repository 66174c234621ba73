/** Missing-value mechanisms (MCAR, MAR, MNAR) whose drivers are recorded as part of the truth. */
package dev.touchstone.generators.missing;

/** The calibration report: what to expect of each learner on data of the analyst's size and shape, in HTML and Markdown. */
package dev.touchstone.reports.calibration;

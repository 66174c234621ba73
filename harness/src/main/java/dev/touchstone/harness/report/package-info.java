/** Gathering a study's report data from its plan and journal, and writing report.html and report.md. */
package dev.touchstone.harness.report;

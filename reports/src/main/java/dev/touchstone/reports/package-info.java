/** Tables (CSV, Markdown) and the self-contained HTML report with charts and graph pictures. */
package dev.touchstone.reports;

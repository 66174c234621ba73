/**
 * Charts of the study report, each drawn once as a {@link dev.touchstone.reports.charts.Figure} and rendered to
 * inline SVG (JFreeSVG) and to PDF (OpenPDF): lines with interval bands and box plots (JFreeChart), difference heat
 * maps, critical difference diagrams, truth-beside-estimate graph pictures.
 */
package dev.touchstone.reports.charts;

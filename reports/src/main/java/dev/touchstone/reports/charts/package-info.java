/** Charts rendered to inline SVG with JFreeChart and JFreeSVG: lines with interval bands, critical difference diagrams, truth-beside-estimate graph pictures. */
package dev.touchstone.reports.charts;

/** A self-contained HTML page builder (inline styles and SVG, nothing fetched). */
package dev.touchstone.reports.html;

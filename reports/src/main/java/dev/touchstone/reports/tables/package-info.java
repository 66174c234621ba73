/** Plain tables and their Markdown rendering; number formatting with undefined values shown as n/a. */
package dev.touchstone.reports.tables;

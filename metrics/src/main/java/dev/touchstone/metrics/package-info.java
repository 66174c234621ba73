/** Scoring estimates against the right truth: structural metrics, SID, result records, aggregation and paired statistics. */
package dev.touchstone.metrics;

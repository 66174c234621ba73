/** How to run it: the local executor, time limits, the journal that makes studies resumable, progress and output files. */
package dev.touchstone.harness.execution;

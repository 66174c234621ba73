/** The tool's version and build commit, read by provenance records and the command line alike. */
package dev.touchstone.harness.version;

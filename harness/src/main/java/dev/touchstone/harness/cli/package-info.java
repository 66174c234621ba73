/** The touchstone command line: verbs, exit codes and error style. */
package dev.touchstone.harness.cli;

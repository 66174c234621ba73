/** The learner catalog: every learner a study or the command line may name, built in, plugged in or declared as a command. */
package dev.touchstone.harness.catalog;

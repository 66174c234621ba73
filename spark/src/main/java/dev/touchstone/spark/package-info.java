/** Runs a study's runs as Apache Spark tasks, one or more whole replicates per task, journaled on the driver. */
package dev.touchstone.spark;

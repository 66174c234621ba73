/** Learners from outside the build: external commands declared in a learners file, and plug-in jars found by the service loader. */
package dev.touchstone.harness.outside;

/** What to run: study files, their validation and their expansion into ordered, immutable run definitions. */
package dev.touchstone.harness.study;

/** The built-in learners, grouped by family, with their independence tests and local scores. */
package dev.touchstone.learners;

/** JMH benchmarks and the scaling driver of the score-based learners and their local scores. */
package dev.touchstone.benchmarks.score;

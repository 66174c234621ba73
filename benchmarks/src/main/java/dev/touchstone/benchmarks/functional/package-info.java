/** JMH benchmarks of the functional (DirectLiNGAM) and continuous-optimisation (NOTEARS) learners. */
package dev.touchstone.benchmarks.functional;

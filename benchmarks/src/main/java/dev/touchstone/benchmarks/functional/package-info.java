/** JMH benchmarks of the functional (DirectLiNGAM, CAM) and continuous-optimisation (NOTEARS) learners. */
package dev.touchstone.benchmarks.functional;

/** Conditional independence tests used by the constraint-based learners: Fisher z, G², χ², the conditional Gaussian likelihood-ratio test and the d-separation oracle. */
package dev.touchstone.learners.independence;

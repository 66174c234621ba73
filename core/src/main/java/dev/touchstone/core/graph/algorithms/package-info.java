/** Graph algorithms: orders, ancestry, separation, equivalence classes, orientation rules, latent projection. */
package dev.touchstone.core.graph.algorithms;

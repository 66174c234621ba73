/** Seed derivation from coordinates, so that results never depend on execution order. */
package dev.touchstone.core.random;

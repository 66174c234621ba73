/** Columnar data sets (continuous, discrete, mixed, with missing cells) and their shared sufficient statistics. */
package dev.touchstone.core.data;

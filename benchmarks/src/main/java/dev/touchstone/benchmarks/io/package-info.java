/** Benchmarks of the data files: reading and writing CSV against reading and copying the bytes. */
package dev.touchstone.benchmarks.io;

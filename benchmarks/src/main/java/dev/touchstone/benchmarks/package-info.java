/** JMH benchmarks, one class per cost that matters; each compares with the irreducible part of its work. */
package dev.touchstone.benchmarks;

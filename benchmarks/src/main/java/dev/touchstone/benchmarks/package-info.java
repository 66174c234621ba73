/** JMH benchmarks, one class per cost that matters (design §11); each compares with the irreducible part of its work. */
package dev.touchstone.benchmarks;

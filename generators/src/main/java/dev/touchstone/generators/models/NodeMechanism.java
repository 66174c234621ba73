package dev.touchstone.generators.models;

import org.apache.commons.rng.UniformRandomProvider;

/**
 * How one variable's column is computed from its parents' columns and its own random
 * stream. Implementations consume a fixed number of draws per row, in row order, so a
 * sample of n rows is the prefix of a sample of N &gt; n rows.
 */
interface NodeMechanism {

    /**
     * Writes this variable's column into {@code columns[node]}.
     *
     * @param columns the columns by graph index ({@code double[]} or {@code int[]}); the
     *                parents' columns are already filled
     * @param rows    rows to generate
     * @param stream  this variable's own random stream
     */
    void fill(Object[] columns, int rows, UniformRandomProvider stream);
}

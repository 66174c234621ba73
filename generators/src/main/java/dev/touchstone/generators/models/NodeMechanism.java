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

    /** Every parameter of this mechanism, by name ({@code variables} by graph index). */
    NodeParameters describe(dev.touchstone.core.graph.Graph graph, dev.touchstone.core.data.Variable[] variables);

    /** The names of these graph indices. */
    static java.util.List<String> names(dev.touchstone.core.graph.Graph graph, int[] indices) {
        java.util.List<String> out = new java.util.ArrayList<>(indices.length);
        for (int i : indices) {
            out.add(graph.name(i));
        }
        return out;
    }

    /**
     * A filler of this variable's column block by block, or null when the mechanism only
     * fills whole columns. The filler allocates the column into {@code columns[node]} and
     * must be given consecutive row blocks from 0; parents' blocks are filled first.
     * Sampling every variable block by block keeps the parents' blocks in cache.
     */
    default BlockFiller blocks(Object[] columns, int rows, UniformRandomProvider stream) {
        return null;
    }

    /** Fills rows [from, to) of one column. */
    interface BlockFiller {
        void fill(int from, int to);
    }
}

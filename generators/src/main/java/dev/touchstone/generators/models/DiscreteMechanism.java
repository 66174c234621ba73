package dev.touchstone.generators.models;

import org.apache.commons.rng.UniformRandomProvider;

/**
 * A discrete variable drawn from a conditional table: the row is the parents'
 * configuration (mixed radix, last parent fastest), the category is found by inverting
 * the row's cumulative distribution with one uniform draw per row.
 */
final class DiscreteMechanism implements NodeMechanism {

    private final int node;
    private final int[] parents;
    private final int[] strides;
    private final int categories;
    private final double[] cumulative;
    private final double[][] table;

    /**
     * @param parents    parent indices in table order
     * @param parentCategories categories of each parent, same order
     * @param table      probabilities, one row per parent configuration (last parent fastest)
     */
    DiscreteMechanism(int node, int[] parents, int[] parentCategories, double[][] table) {
        this.node = node;
        this.parents = parents.clone();
        this.strides = new int[parents.length];
        int stride = 1;
        for (int k = parents.length - 1; k >= 0; k--) {
            strides[k] = stride;
            stride *= parentCategories[k];
        }
        if (table.length != stride) {
            throw new IllegalArgumentException("a table over parents with " + stride + " configurations has "
                    + table.length + " rows");
        }
        this.categories = table[0].length;
        this.table = new double[table.length][];
        for (int c = 0; c < table.length; c++) {
            this.table[c] = table[c].clone();
        }
        this.cumulative = new double[stride * categories];
        for (int c = 0; c < stride; c++) {
            double acc = 0;
            for (int j = 0; j < categories; j++) {
                acc += table[c][j];
                cumulative[c * categories + j] = acc;
            }
            // Guard against rounding: the last category takes whatever is left.
            cumulative[c * categories + categories - 1] = Double.POSITIVE_INFINITY;
        }
    }

    @Override
    public NodeParameters describe(dev.touchstone.core.graph.Graph graph, dev.touchstone.core.data.Variable[] variables) {
        double[][] copy = new double[table.length][];
        for (int c = 0; c < copy.length; c++) {
            copy[c] = table[c].clone();
        }
        return new NodeParameters.Table(graph.name(node), variables[node].categories(),
                NodeMechanism.names(graph, parents), copy);
    }

    @Override
    public void fill(Object[] columns, int rows, UniformRandomProvider stream) {
        int[] out = new int[rows];
        int[][] in = new int[parents.length][];
        for (int k = 0; k < parents.length; k++) {
            in[k] = (int[]) columns[parents[k]];
        }
        int last = categories - 1;
        for (int r = 0; r < rows; r++) {
            int row = 0;
            for (int k = 0; k < in.length; k++) {
                row += in[k][r] * strides[k];
            }
            int base = row * categories;
            double u = stream.nextDouble();
            int c = 0;
            while (c < last && u >= cumulative[base + c]) {
                c++;
            }
            out[r] = c;
        }
        columns[node] = out;
    }
}

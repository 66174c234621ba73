package dev.touchstone.generators.graphs;

import dev.touchstone.core.graph.MutableGraph;
import dev.touchstone.core.knowledge.Knowledge;
import dev.touchstone.core.param.ParameterSpec;
import dev.touchstone.core.param.ParameterValues;
import dev.touchstone.core.random.Shuffles;
import dev.touchstone.generators.DeclaredGenerator;
import org.apache.commons.rng.UniformRandomProvider;

import java.util.Arrays;
import java.util.List;

/**
 * Random DAGs in which every variable has the same number of parents, k, chosen uniformly
 * among the variables before it in a random causal order (the first k variables of the
 * order have as many as there are before them). Common practice in simulation studies that
 * control the in-degree directly. Cost O(n k).
 */
public final class FixedInDegreeFamily extends DeclaredGenerator implements GraphFamily {

    public static final String ID = "fixed-in-degree";

    static final ParameterSpec IN_DEGREE = ParameterSpec.integer("in_degree", 2, 0, 1000,
            "number of parents of every variable (fewer for the first variables of the order)");

    public FixedInDegreeFamily() {
        super(ID, "every variable has the same number of parents, drawn from earlier variables",
                "common practice",
                List.of(CausalOrder.NODES, IN_DEGREE));
    }

    @Override
    public GeneratedGraph generate(ParameterValues values, UniformRandomProvider random) {
        int n = values.getInt("nodes");
        int k = values.getInt(IN_DEGREE.name());
        CausalOrder order = CausalOrder.random(n, random);
        MutableGraph g = order.newGraph();
        for (int later = 1; later < n; later++) {
            int take = Math.min(k, later);
            if (take == 0) {
                continue;
            }
            int[] parents = distinct(random, later, take);
            for (int earlier : parents) {
                order.addEdge(g, earlier, later);
            }
        }
        return order.result(g, Knowledge.none());
    }

    /**
     * {@code k} distinct values in [0, bound): by rejection when k is small against the bound
     * (cost O(k²)), otherwise by a partial Fisher–Yates shuffle (cost O(bound)).
     */
    static int[] distinct(UniformRandomProvider random, int bound, int k) {
        int[] out = new int[k];
        if (4L * k * k < bound) {
            int filled = 0;
            while (filled < k) {
                int c = random.nextInt(bound);
                boolean seen = false;
                for (int i = 0; i < filled && !seen; i++) {
                    seen = out[i] == c;
                }
                if (!seen) {
                    out[filled++] = c;
                }
            }
            return out;
        }
        return Arrays.copyOf(Shuffles.shuffleHead(random, Shuffles.identity(bound), k), k);
    }
}

package dev.touchstone.generators.graphs;

import dev.touchstone.core.graph.MutableGraph;
import dev.touchstone.core.knowledge.Knowledge;
import dev.touchstone.core.param.ParameterException;
import dev.touchstone.core.param.ParameterSpec;
import dev.touchstone.core.param.ParameterValues;
import dev.touchstone.generators.DeclaredGenerator;
import org.apache.commons.rng.UniformRandomProvider;

import java.util.ArrayList;
import java.util.List;

/**
 * Layered random DAGs: the variables, in a random order, are split into L layers of
 * near-equal size, and each pair of variables in different layers is joined with
 * probability p, pointing from the earlier layer to the later one (only between
 * neighbouring layers with {@code links = next-layer}). No edge joins two variables of one
 * layer. The layers come out as tiers of background knowledge, as a temporal order would
 * (Spirtes, Glymour and Scheines 2000, §5.8 for tiers; the layered construction is common
 * practice). Cost O(n²).
 */
public final class LayeredFamily extends DeclaredGenerator implements GraphFamily {

    public static final String ID = "layered";

    static final ParameterSpec LAYERS = ParameterSpec.integer("layers", 3, 1, 10_000,
            "number of layers (tiers); sizes differ by at most one");
    static final ParameterSpec EDGE_PROBABILITY = ParameterSpec.real("edge_probability", 0.3, 0.0, 1.0,
            "probability of an edge between two variables in linked layers");
    static final ParameterSpec LINKS = ParameterSpec.choice("links", "all-later-layers",
            List.of("all-later-layers", "next-layer"),
            "whether edges may skip layers or only join neighbouring layers");

    public LayeredFamily() {
        super(ID, "layers of variables, edges only from earlier to later layers; layers are also tier knowledge",
                "common practice (tiers as in Spirtes, Glymour and Scheines 2000, §5.8)",
                List.of(CausalOrder.NODES, LAYERS, EDGE_PROBABILITY, LINKS));
    }

    @Override
    public GeneratedGraph generate(ParameterValues values, UniformRandomProvider random) {
        int n = values.getInt("nodes");
        int layers = values.getInt(LAYERS.name());
        if (layers > n) {
            throw new ParameterException(LAYERS.name(), "parameter 'layers': " + layers
                    + " layers cannot be filled by nodes = " + n);
        }
        double p = values.getDouble(EDGE_PROBABILITY.name());
        boolean nextOnly = values.getString(LINKS.name()).equals("next-layer");
        CausalOrder order = CausalOrder.random(n, random);
        int[] layerOf = new int[n];
        for (int pos = 0; pos < n; pos++) {
            layerOf[pos] = (int) ((long) pos * layers / n);
        }
        MutableGraph g = order.newGraph();
        for (int a = 0; a < n; a++) {
            for (int b = a + 1; b < n; b++) {
                int gap = layerOf[b] - layerOf[a];
                if (gap == 0 || (nextOnly && gap > 1)) {
                    continue;
                }
                if (random.nextDouble() < p) {
                    order.addEdge(g, a, b);
                }
            }
        }
        List<String> inOrder = order.namesInOrder();
        Knowledge.Builder k = Knowledge.builder();
        int pos = 0;
        for (int layer = 0; layer < layers; layer++) {
            List<String> tier = new ArrayList<>();
            while (pos < n && layerOf[pos] == layer) {
                tier.add(inOrder.get(pos++));
            }
            tier.sort(null);
            k.tier(tier);
        }
        return order.result(g, k.build());
    }
}

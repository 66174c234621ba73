package dev.touchstone.generators.graphs;

import dev.touchstone.core.graph.MutableGraph;
import dev.touchstone.core.knowledge.Knowledge;
import dev.touchstone.core.param.ParameterException;
import dev.touchstone.core.param.ParameterSpec;
import dev.touchstone.core.param.ParameterValues;
import dev.touchstone.generators.DeclaredGenerator;
import org.apache.commons.rng.UniformRandomProvider;
import org.jgrapht.Graph;
import org.jgrapht.generate.BarabasiAlbertGraphGenerator;
import org.jgrapht.graph.DefaultEdge;

import java.util.List;

/**
 * Scale-free DAGs by preferential attachment (Barabási and Albert 1999, "Emergence of
 * scaling in random networks", Science 286): starting from a complete graph on m + 1
 * variables, each new variable joins m existing ones chosen with probability proportional
 * to their degree, which gives a degree distribution with tail exponent near 3. Edges are
 * oriented by arrival: with {@code hubs = causes} from the older variable to the newer one
 * (early, well-connected variables become causes of many), with {@code hubs = effects} the
 * other way round. Arrival order is mapped to a random permutation of the names. Uses
 * JGraphT's {@link BarabasiAlbertGraphGenerator}. Cost O(n m) expected.
 */
public final class PreferentialAttachmentFamily extends DeclaredGenerator implements GraphFamily {

    public static final String ID = "scale-free";

    static final ParameterSpec EDGES_PER_NODE = ParameterSpec.integer("edges_per_node", 1, 1, 1000,
            "edges each arriving variable adds (m); mean degree is about 2 m");
    static final ParameterSpec HUBS = ParameterSpec.choice("hubs", "causes", List.of("causes", "effects"),
            "whether well-connected early variables are causes (edges point away) or effects (edges point in)");

    public PreferentialAttachmentFamily() {
        super(ID, "preferential attachment (scale-free degrees), hubs as causes or as effects",
                "Barabási and Albert (1999), Emergence of scaling in random networks, Science 286",
                List.of(CausalOrder.NODES, EDGES_PER_NODE, HUBS));
    }

    @Override
    public GeneratedGraph generate(ParameterValues values, UniformRandomProvider random) {
        int n = values.getInt("nodes");
        int m = values.getInt(EDGES_PER_NODE.name());
        if (n < m + 1) {
            throw new ParameterException("nodes", "parameter 'nodes': " + n
                    + " is too few for edges_per_node = " + m + " (need at least " + (m + 1) + ")");
        }
        boolean hubsAreCauses = values.getString(HUBS.name()).equals("causes");
        CausalOrder order = CausalOrder.random(n, random);
        Graph<Integer, DefaultEdge> undirected = UndirectedGraphs.empty();
        new BarabasiAlbertGraphGenerator<Integer, DefaultEdge>(m + 1, m, n, new RandomAdapter(random))
                .generateGraph(undirected);
        MutableGraph g = order.newGraph();
        for (int[] e : UndirectedGraphs.positionPairs(undirected)) {
            int a = hubsAreCauses ? e[0] : n - 1 - e[0];
            int b = hubsAreCauses ? e[1] : n - 1 - e[1];
            order.addEdge(g, a, b);
        }
        return order.result(g, Knowledge.none());
    }
}

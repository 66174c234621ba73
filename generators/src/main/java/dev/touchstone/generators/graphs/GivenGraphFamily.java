package dev.touchstone.generators.graphs;

import dev.touchstone.core.graph.Edge;
import dev.touchstone.core.graph.Graph;
import dev.touchstone.core.graph.algorithms.Ancestry;
import dev.touchstone.core.knowledge.Knowledge;
import dev.touchstone.core.param.ParameterSpec;
import dev.touchstone.core.param.ParameterValues;
import dev.touchstone.generators.DeclaredGenerator;
import org.apache.commons.rng.UniformRandomProvider;

import java.util.ArrayList;
import java.util.List;
import java.util.Objects;

/**
 * A fixed DAG used as the truth, such as one read from a graph file. The registry lists an
 * unbound entry (its {@code file} parameter tells the harness which file to read; core and
 * generators do no file I/O); {@link #of(Graph)} binds a graph. Hidden flags of the given
 * graph are kept (a hidden-variable option may change them). Cost O(1) per draw.
 */
public final class GivenGraphFamily extends DeclaredGenerator implements GraphFamily {

    public static final String ID = "given";

    static final ParameterSpec FILE = ParameterSpec.text("file", "",
            "graph file (JSON or CSV edge list) holding the true DAG; read by the harness");

    private final Graph dag;
    private final List<String> order;

    private GivenGraphFamily(Graph dag) {
        super(ID, "a fixed DAG given as a value, for example read from a graph file",
                "none (the user's own graph)",
                List.of(FILE));
        this.dag = dag;
        if (dag == null) {
            this.order = List.of();
        } else {
            int[] topo = Ancestry.topologicalOrder(dag);
            List<String> names = new ArrayList<>(dag.size());
            for (int v : topo) {
                names.add(dag.name(v));
            }
            this.order = List.copyOf(names);
        }
    }

    /** The listing entry, with no graph bound. */
    static GivenGraphFamily unbound() {
        return new GivenGraphFamily(null);
    }

    /**
     * The family that always yields {@code dag}.
     *
     * @throws IllegalArgumentException naming the first edge that is not directed, or saying
     *     the directed edges form a cycle
     */
    public static GivenGraphFamily of(Graph dag) {
        Objects.requireNonNull(dag, "dag");
        for (Edge e : dag.edges()) {
            if (!e.isDirected()) {
                throw new IllegalArgumentException("the given graph is not a DAG: edge " + dag.name(e.a()) + " "
                        + e.atA().word() + "-" + e.atB().word() + " " + dag.name(e.b()) + " is not directed");
            }
        }
        if (!Ancestry.isAcyclic(dag)) {
            throw new IllegalArgumentException("the given graph is not a DAG: its directed edges form a cycle");
        }
        return new GivenGraphFamily(dag);
    }

    /** Whether a graph is bound (the listing entry has none). */
    public boolean isBound() {
        return dag != null;
    }

    /**
     * The bound graph; the random source is not used.
     *
     * @throws IllegalStateException when no graph is bound
     */
    @Override
    public GeneratedGraph generate(ParameterValues values, UniformRandomProvider random) {
        if (dag == null) {
            throw new IllegalStateException("graph family 'given' has no graph bound: the harness reads the file "
                    + "and calls GivenGraphFamily.of(graph)");
        }
        return new GeneratedGraph(dag, Knowledge.none(), order);
    }
}

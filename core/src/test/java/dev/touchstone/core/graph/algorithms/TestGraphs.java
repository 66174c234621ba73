package dev.touchstone.core.graph.algorithms;

import dev.touchstone.core.graph.Graph;
import dev.touchstone.core.graph.MutableGraph;

import java.util.Arrays;
import java.util.List;

/** Hand-written graphs for tests, in a compact text form, and the two reference networks. */
final class TestGraphs {

    private TestGraphs() {
    }

    /**
     * A graph over the space-separated {@code names} with the comma-separated edges
     * {@code a->b}, {@code a<-b}, {@code a--b} (undirected), {@code a<>b} (bidirected) or
     * {@code ao>b} (circle at a).
     */
    static Graph of(String names, String edges) {
        return mutable(names, edges).freeze();
    }

    static MutableGraph mutable(String names, String edges) {
        MutableGraph g = Graph.builder(List.of(names.trim().split("\\s+")));
        if (edges.isBlank()) {
            return g;
        }
        for (String e : edges.split(",")) {
            String t = e.trim();
            String[] ops = {"->", "<-", "--", "<>", "o>"};
            boolean done = false;
            for (String op : ops) {
                int i = t.indexOf(op);
                if (i > 0) {
                    int a = index(g, t.substring(0, i).trim());
                    int b = index(g, t.substring(i + 2).trim());
                    switch (op) {
                        case "->": g.addDirected(a, b); break;
                        case "<-": g.addDirected(b, a); break;
                        case "--": g.addUndirected(a, b); break;
                        case "<>": g.addBidirected(a, b); break;
                        default: g.addEdge(a, b, dev.touchstone.core.graph.Mark.CIRCLE, dev.touchstone.core.graph.Mark.ARROW);
                    }
                    done = true;
                    break;
                }
            }
            if (!done) {
                throw new IllegalArgumentException("cannot read edge '" + t + "'");
            }
        }
        return g;
    }

    private static int index(MutableGraph g, String name) {
        int i = g.indexOf(name);
        if (i < 0) {
            throw new IllegalArgumentException("unknown name '" + name + "' among " + g.names());
        }
        return i;
    }

    /** Pearl's sprinkler network (Pearl 2000, Causality, ch. 1). */
    static Graph sprinkler() {
        return of("season sprinkler rain wet slippery",
                "season->sprinkler, season->rain, sprinkler->wet, rain->wet, wet->slippery");
    }

    /** The chest-clinic network (Lauritzen and Spiegelhalter 1988), 8 arcs. */
    static Graph asia() {
        return of("asia tub smoke lung bronc either xray dysp",
                "asia->tub, smoke->lung, smoke->bronc, tub->either, lung->either, either->xray,"
                        + " either->dysp, bronc->dysp");
    }

    /** Shorthand for an int array. */
    static int[] ints(int... v) {
        return Arrays.copyOf(v, v.length);
    }
}

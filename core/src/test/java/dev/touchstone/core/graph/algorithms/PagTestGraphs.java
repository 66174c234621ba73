package dev.touchstone.core.graph.algorithms;

import dev.touchstone.core.graph.Graph;
import dev.touchstone.core.graph.Mark;
import dev.touchstone.core.graph.MutableGraph;

import java.util.Arrays;
import java.util.List;

/** Graphs written the way the papers draw them, e.g. {@code graph("A B C", "A --> B; B <-> C")}. */
final class PagTestGraphs {

    private PagTestGraphs() {
    }

    /** A graph over the space-separated names with the {@code ;}-separated edges. */
    static Graph graph(String names, String edges) {
        return hidden(names, "", edges);
    }

    /** As {@link #graph}, with the space-separated {@code hidden} names flagged hidden. */
    static Graph hidden(String names, String hidden, String edges) {
        List<String> list = Arrays.asList(names.trim().split("\\s+"));
        MutableGraph g = Graph.builder(list);
        for (String h : hidden.trim().isEmpty() ? new String[0] : hidden.trim().split("\\s+")) {
            g.setHidden(list.indexOf(h), true);
        }
        for (String edge : edges.split(";")) {
            if (edge.isBlank()) {
                continue;
            }
            String[] parts = edge.trim().split("\\s+");
            if (parts.length != 3 || parts[1].length() != 3) {
                throw new IllegalArgumentException("bad edge '" + edge + "'");
            }
            int a = g.indexOf(parts[0]);
            int b = g.indexOf(parts[2]);
            if (a < 0 || b < 0) {
                throw new IllegalArgumentException("unknown name in '" + edge + "'");
            }
            g.addEdge(a, b, mark(parts[1].charAt(0)), mark(parts[1].charAt(2)));
        }
        return g.freeze();
    }

    private static Mark mark(char c) {
        switch (c) {
            case '<':
            case '>':
                return Mark.ARROW;
            case 'o':
                return Mark.CIRCLE;
            case '-':
                return Mark.TAIL;
            default:
                throw new IllegalArgumentException("bad mark '" + c + "'");
        }
    }

    /** Reverses covered edges at random (Chickering 1995: each reversal keeps the Markov equivalence class). */
    static Graph reverseCoveredEdges(Graph dag, int steps, org.apache.commons.rng.UniformRandomProvider rng) {
        MutableGraph g = dag.toMutable();
        for (int s = 0; s < steps; s++) {
            Graph now = g.freeze();
            java.util.List<int[]> covered = new java.util.ArrayList<>();
            for (dev.touchstone.core.graph.Edge e : now.edges()) {
                int from = e.isDirectedFrom(e.a()) ? e.a() : e.b();
                int to = e.other(from);
                // from → to is covered when pa(to) = pa(from) ∪ {from}.
                int[] paTo = now.parents(to);
                int[] paFrom = now.parents(from);
                int[] expected = Arrays.copyOf(paFrom, paFrom.length + 1);
                expected[paFrom.length] = from;
                Arrays.sort(expected);
                if (Arrays.equals(paTo, expected)) {
                    covered.add(new int[] {from, to});
                }
            }
            if (covered.isEmpty()) {
                break;
            }
            int[] pick = covered.get(rng.nextInt(covered.size()));
            g.orient(pick[1], pick[0]);
        }
        return g.freeze();
    }
}

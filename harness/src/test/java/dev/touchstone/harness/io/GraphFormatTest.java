package dev.touchstone.harness.io;

import dev.touchstone.core.graph.Edge;
import dev.touchstone.core.graph.Graph;
import dev.touchstone.core.graph.GraphClass;
import dev.touchstone.core.graph.Mark;
import dev.touchstone.core.graph.MutableGraph;
import dev.touchstone.core.graph.algorithms.Cpdags;
import dev.touchstone.core.random.Seeds;
import dev.touchstone.metrics.truth.TruthSelection;

import org.apache.commons.rng.UniformRandomProvider;
import org.jgrapht.graph.DefaultEdge;
import org.jgrapht.graph.DirectedPseudograph;
import org.jgrapht.nio.Attribute;
import org.jgrapht.nio.dot.DOTImporter;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

import java.io.IOException;
import java.io.StringReader;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.HashMap;
import java.util.HashSet;
import java.util.List;
import java.util.Map;
import java.util.Set;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertNull;
import static org.junit.jupiter.api.Assertions.assertSame;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

/** Every graph format by file name: round trips for every graph class, DOT directions as JGraphT reads them. */
class GraphFormatTest {

    @TempDir
    Path dir;

    /** A random DAG over shuffled names, some of them awkward for DOT and CSV, a few hidden. */
    private static Graph randomDag(UniformRandomProvider rng, boolean hide) {
        int n = 2 + rng.nextInt(9);
        List<String> names = new ArrayList<>();
        for (int i = 0; i < n; i++) {
            names.add(rng.nextInt(4) == 0 ? "v \"" + i + "\", odd" : "v" + i);
        }
        int[] order = new int[n];
        for (int i = 0; i < n; i++) {
            order[i] = i;
        }
        for (int i = n - 1; i > 0; i--) {
            int j = rng.nextInt(i + 1);
            int t = order[i];
            order[i] = order[j];
            order[j] = t;
        }
        MutableGraph g = Graph.builder(names);
        for (int a = 0; a < n; a++) {
            for (int b = a + 1; b < n; b++) {
                if (rng.nextInt(3) == 0) {
                    g.addDirected(order[a], order[b]);
                }
            }
        }
        if (hide) {
            g.setHidden(rng.nextInt(n), true);
        }
        return g.freeze();
    }

    /** Graphs of every class: DAGs, their CPDAGs, MAGs and PAGs (from DAGs with a hidden variable), any marks. */
    private static List<Graph> graphsOfEveryClass() {
        UniformRandomProvider rng = Seeds.random(17);
        List<Graph> out = new ArrayList<>();
        for (int t = 0; t < 15; t++) {
            Graph dag = randomDag(rng, false);
            out.add(dag);
            out.add(Cpdags.of(dag));
            Graph hidden = randomDag(rng, true);
            out.add(hidden);
            out.add(TruthSelection.as(hidden, GraphClass.MAG).reference());
            out.add(TruthSelection.as(hidden, GraphClass.PAG).reference());
            MutableGraph any = Graph.builder(dag.names());
            Mark[] marks = Mark.values();
            for (Edge e : dag.edges()) {
                any.addEdge(e.a(), e.b(), marks[rng.nextInt(3)], marks[rng.nextInt(3)]);
            }
            out.add(any.freeze());
        }
        return out;
    }

    @Test
    void theNameChoosesTheFormat() {
        assertSame(GraphFormat.JSON, GraphFormat.of(Path.of("g.json")));
        assertSame(GraphFormat.EDGE_LIST, GraphFormat.of(Path.of("out/g.CSV")));
        assertSame(GraphFormat.MATRIX, GraphFormat.of(Path.of("g.matrix.csv")));
        assertSame(GraphFormat.DOT, GraphFormat.of(Path.of("g.dot")));
        assertSame(GraphFormat.DOT, GraphFormat.of(Path.of("g.gv")));
        assertNull(GraphFormat.forName(".json"), "a bare ending is no file name");
        String m = assertThrows(FileFormatException.class, () -> GraphFormat.of(Path.of("g.graphml"))).getMessage();
        assertEquals("g.graphml: cannot tell the graph format from the name (accepted: .json graph JSON,"
                + " .matrix.csv adjacency-matrix CSV, .csv CSV edge list, .dot or .gv DOT)", m);
    }

    @Test
    void everyFormatRoundTripsEveryClass() throws IOException {
        int k = 0;
        for (Graph g : graphsOfEveryClass()) {
            for (GraphFormat f : GraphFormat.values()) {
                Path file = dir.resolve("g" + (k++) + f.endings().get(0));
                GraphFiles.write(file, g, "round trip");
                Graph back = f == GraphFormat.EDGE_LIST ? GraphFiles.read(file, g.names(), null)
                        : GraphFiles.read(file, null);
                Graph expected = f.keepsHidden() ? g : g.withHidden(Set.of());
                assertEquals(expected, back, f + " of " + g);
                assertEquals(f.text(g, "round trip"), Files.readString(file), "printing and writing agree");
            }
        }
    }

    @Test
    void theClassIsCheckedOnReading() throws IOException {
        MutableGraph g = Graph.builder(List.of("A", "B", "C"));
        g.addDirected(0, 1).addDirected(1, 2).addDirected(2, 0);
        for (GraphFormat f : GraphFormat.values()) {
            Path file = dir.resolve("cycle" + f.endings().get(0));
            f.write(file, g.freeze(), "cycle");
            String m = assertThrows(FileFormatException.class, () -> f.read(file, null, GraphClass.DAG)).getMessage();
            assertTrue(m.startsWith(file.toString()) && m.contains("the edges form a directed cycle (A -> B -> C -> A), but a DAG has none"), m);
        }
    }

    /** Edges a general DOT reader sees, as source → target names. */
    private static Set<List<String>> edgesAsJgraphtReadsThem(String dot, boolean onlyPlainArrows) {
        DirectedPseudograph<String, DefaultEdge> g = new DirectedPseudograph<>(null, DefaultEdge::new, false);
        DOTImporter<String, DefaultEdge> importer = new DOTImporter<>();
        importer.setVertexFactory(id -> id);
        Map<DefaultEdge, Map<String, Attribute>> attrs = new HashMap<>();
        importer.addEdgeAttributeConsumer((ea, a) -> attrs.computeIfAbsent(ea.getFirst(), x -> new HashMap<>())
                .put(ea.getSecond(), a));
        importer.importGraph(g, new StringReader(dot));
        Set<List<String>> out = new HashSet<>();
        for (DefaultEdge e : g.edgeSet()) {
            Map<String, Attribute> a = attrs.getOrDefault(e, Map.of());
            boolean plain = a.containsKey("arrowtail") && a.get("arrowtail").getValue().equals("none")
                    && a.containsKey("arrowhead") && a.get("arrowhead").getValue().equals("normal");
            if (!onlyPlainArrows || plain) {
                out.add(List.of(g.getEdgeSource(e), g.getEdgeTarget(e)));
            }
        }
        return out;
    }

    private static Set<List<String>> directedEdges(Graph g) {
        Set<List<String>> out = new HashSet<>();
        for (Edge e : g.edges()) {
            if (e.isDirected()) {
                int from = e.isDirectedFrom(e.a()) ? e.a() : e.b();
                out.add(List.of(g.name(from), g.name(e.other(from))));
            }
        }
        return out;
    }

    @Test
    void jgraphtReadsOurDotInTheTrueDirections() {
        // Outside reader: JGraphT's DOTImporter (jgrapht-io 1.5.3), which knows nothing of our marks.
        UniformRandomProvider rng = Seeds.random(3);
        for (int t = 0; t < 30; t++) {
            Graph dag = randomDag(rng, false);
            Set<List<String>> truth = directedEdges(dag);
            assertEquals(dag.edgeCount(), truth.size());
            assertEquals(truth, edgesAsJgraphtReadsThem(GraphDot.toDot(dag, "dag"), false), "every edge of a DAG");
            Graph cpdag = Cpdags.of(dag);
            assertEquals(directedEdges(cpdag), edgesAsJgraphtReadsThem(GraphDot.toDot(cpdag, "cpdag"), true),
                    "the directed edges of a CPDAG");
        }
        // The case reported: X2 → X1 must not come out as X1 -> X2.
        MutableGraph g = Graph.builder(List.of("X1", "X2"));
        g.addDirected(1, 0);
        assertEquals(Set.of(List.of("X2", "X1")), edgesAsJgraphtReadsThem(GraphDot.toDot(g.freeze(), "g"), false));
    }

    @Test
    void dotFromElsewhereFollowsGraphvizRules() throws IOException {
        Path f = dir.resolve("plain.dot");
        Files.writeString(f, "digraph { a -> b; b -> c [dir=none]; c -> d [dir=both, arrowtail=odot];"
                + " d -> e [dir=back]; h [style=\"dashed,filled\"]; h -> a }\n");
        Graph g = GraphFiles.read(f, null);
        assertEquals(List.of("a", "b", "c", "d", "e", "h"), g.names());
        assertTrue(g.hasDirected(g.index("a"), g.index("b")));
        assertTrue(g.hasUndirected(g.index("b"), g.index("c")));
        assertEquals(new Edge(g.index("c"), g.index("d"), Mark.CIRCLE, Mark.ARROW).canonical(),
                g.edge(g.index("c"), g.index("d")).canonical());
        assertTrue(g.hasDirected(g.index("e"), g.index("d")), "dir=back puts the arrow at the first node");
        assertEquals(Set.of("h"), g.hiddenNames());
        Path u = dir.resolve("undirected.gv");
        Files.writeString(u, "graph { a -- b }\n");
        assertTrue(GraphFiles.read(u, null).hasUndirected(0, 1));
        Path bad = dir.resolve("bad.dot");
        Files.writeString(bad, "digraph { a -> }\n");
        assertTrue(assertThrows(FileFormatException.class, () -> GraphFiles.read(bad, null)).getMessage()
                .contains("bad.dot: not valid DOT"));
    }

    @Test
    void matrixUsesTheDocumentedCodes() throws IOException {
        MutableGraph g = Graph.builder(List.of("A", "B", "C", "D"));
        g.addDirected(0, 1).addEdge(1, 2, Mark.CIRCLE, Mark.ARROW).addUndirected(2, 3);
        String text = GraphFormat.MATRIX.text(g.freeze(), null);
        assertEquals("\"\",A,B,C,D\nA,0,2,0,0\nB,1,0,2,0\nC,0,3,0,1\nD,0,0,1,0\n", text);
    }

    private String matrixRefused(String text) throws IOException {
        Path f = dir.resolve("bad.matrix.csv");
        Files.writeString(f, text);
        return assertThrows(FileFormatException.class, () -> GraphMatrixCsv.read(f, null)).getMessage();
    }

    @Test
    void matrixErrorsNameLineAndColumn() throws IOException {
        assertTrue(matrixRefused(",A,B\nA,0,2\nB,0,0\n").endsWith("bad.matrix.csv, line 2, column 'B': 'A' and 'B'"
                + " have codes 2 and 0 (line 3): an edge needs a mark at both ends, no edge 0 at both"));
        assertTrue(matrixRefused(",A,B\nA,0,7\nB,1,0\n").endsWith("bad.matrix.csv, line 2, column 'B': '7' is not"
                + " a mark code (0 none, 1 tail, 2 arrow, 3 circle)"));
        assertTrue(matrixRefused(",A,B\nB,0,1\nA,1,0\n").endsWith("bad.matrix.csv, line 2: row 1 is 'B' but the"
                + " header's variable 1 is 'A'"));
        assertTrue(matrixRefused(",A,B\nA,0,1\n").endsWith("bad.matrix.csv: 1 rows for 2 variables: the matrix"
                + " must be square"));
        assertTrue(matrixRefused(",A,B\nA,1,0\nB,0,0\n").endsWith("bad.matrix.csv, line 2, column 'A': the"
                + " diagonal must be 0 (a variable has no edge to itself)"));
        assertTrue(matrixRefused("A,B\n").endsWith("bad.matrix.csv, line 1: expected the header: an empty cell,"
                + " then the variable names"));
    }
}

package dev.touchstone.harness.io;

import dev.touchstone.core.graph.Graph;
import dev.touchstone.core.graph.GraphClass;
import dev.touchstone.core.graph.Mark;
import dev.touchstone.core.graph.MutableGraph;
import dev.touchstone.core.random.Seeds;

import com.fasterxml.jackson.databind.ObjectMapper;
import org.apache.commons.rng.UniformRandomProvider;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.Set;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

class GraphFilesTest {

    @TempDir
    Path dir;

    private Path file(String name, String text) throws IOException {
        Path f = dir.resolve(name);
        Files.writeString(f, text);
        return f;
    }

    /** A → B, B ∘→ C, C ↔ D, with C hidden and E isolated. */
    private static Graph sample() {
        MutableGraph g = Graph.builder(List.of("A", "B", "C", "D", "E"));
        g.addDirected(0, 1).addEdge(1, 2, Mark.CIRCLE, Mark.ARROW).addBidirected(2, 3).setHidden(2, true);
        return g.freeze();
    }

    private static Graph randomGraph(UniformRandomProvider rng) {
        int n = 1 + rng.nextInt(10);
        List<String> names = new ArrayList<>();
        for (int i = 0; i < n; i++) {
            names.add(rng.nextInt(4) == 0 ? "v \"" + i + "\", odd" : "v" + i);
        }
        MutableGraph g = Graph.builder(names);
        Mark[] marks = Mark.values();
        for (int a = 0; a < n; a++) {
            g.setHidden(a, rng.nextInt(5) == 0);
            for (int b = a + 1; b < n; b++) {
                if (rng.nextInt(3) == 0) {
                    Mark atA = marks[rng.nextInt(3)];
                    Mark atB = marks[rng.nextInt(3)];
                    // directed edges point from the smaller index to the larger: graph files refuse directed cycles
                    if (atA == Mark.ARROW && atB == Mark.TAIL) {
                        atA = Mark.TAIL;
                        atB = Mark.ARROW;
                    }
                    g.addEdge(a, b, atA, atB);
                }
            }
        }
        return g.freeze();
    }

    // ---- JSON ----

    @Test
    void jsonHasTheDocumentedShape() {
        assertEquals("{\n"
                + "  \"variables\": [\"A\", \"B\", \"C\", \"D\", \"E\"],\n"
                + "  \"hidden\": [\"C\"],\n"
                + "  \"edges\": [\n"
                + "    {\"between\": [\"A\", \"B\"], \"marks\": [\"tail\", \"arrow\"]},\n"
                + "    {\"between\": [\"B\", \"C\"], \"marks\": [\"circle\", \"arrow\"]},\n"
                + "    {\"between\": [\"C\", \"D\"], \"marks\": [\"arrow\", \"arrow\"]}\n"
                + "  ]\n"
                + "}\n", GraphJson.toJson(sample()));
        assertEquals("{\n  \"variables\": [\"X\"],\n  \"hidden\": [],\n  \"edges\": []\n}\n",
                GraphJson.toJson(Graph.empty(List.of("X"))));
    }

    /**
     * Names are quoted as Jackson's data binding writes a JSON string (the writer no longer
     * uses it, so that writing a graph does not load it): quote, backslash, control
     * characters, and non-ASCII text left as it is. The reference is the general-purpose
     * library's {@code ObjectMapper.writeValueAsString}; the names read back the same.
     */
    @Test
    void jsonQuotesNamesAsTheJacksonMapperDoes() throws IOException {
        List<String> names = List.of("a\"b", "back\\slash", "tab\tnew\nline", "bell\u0007", "del\u007f",
                "\u00e9t\u00e9 \u4e2d", "slash/", "\ud83d\ude00");
        String json = GraphJson.toJson(Graph.empty(names));
        ObjectMapper mapper = new ObjectMapper();
        StringBuilder expected = new StringBuilder();
        for (String n : names) {
            expected.append(expected.length() == 0 ? "" : ", ").append(mapper.writeValueAsString(n));
        }
        assertTrue(json.startsWith("{\n  \"variables\": [" + expected + "],\n"), json);
        Path f = dir.resolve("quoted.json");
        Files.writeString(f, json);
        assertEquals(names, GraphJson.read(f).names());
    }

    @Test
    void jsonReadsTheExampleOfTheBrief() throws IOException {
        Path f = file("g.json", "{\"variables\": [\"A\",\"B\",\"C\"], \"hidden\": [\"C\"], "
                + "\"edges\": [{\"between\": [\"B\",\"A\"], \"marks\": [\"arrow\",\"tail\"]}]}");
        Graph g = GraphJson.read(f, GraphClass.DAG);
        assertTrue(g.hasDirected(0, 1));
        assertTrue(g.isHidden(2));
        assertEquals(1, g.edgeCount());
    }

    @Test
    void jsonRoundTripOnRandomGraphs() throws IOException {
        UniformRandomProvider rng = Seeds.random(5);
        for (int t = 0; t < 50; t++) {
            Graph g = randomGraph(rng);
            Path f = dir.resolve("r" + t + ".json");
            // a few through the atomic writer; the rest directly, to keep the test fast (each atomic write syncs twice)
            if (t < 5) {
                GraphJson.write(f, g);
            } else {
                Files.writeString(f, GraphJson.toJson(g));
            }
            assertEquals(g, GraphJson.read(f));
        }
    }

    private String jsonRefused(String text, GraphClass expected) throws IOException {
        Path f = file("bad.json", text);
        return assertThrows(FileFormatException.class, () -> GraphJson.read(f, expected)).getMessage();
    }

    private static String edges(String... edges) {
        return "{\"variables\": [\"A\",\"B\",\"C\"], \"edges\": [" + String.join(",", edges) + "]}";
    }

    private static String edge(String a, String b, String ma, String mb) {
        return "{\"between\": [\"" + a + "\",\"" + b + "\"], \"marks\": [\"" + ma + "\",\"" + mb + "\"]}";
    }

    @Test
    void jsonErrorsNameFileAndEdge() throws IOException {
        assertTrue(jsonRefused(edges(edge("A", "Q", "tail", "arrow")), null)
                .endsWith("bad.json, edge 1 (A, Q): unknown variable 'Q'"));
        assertTrue(jsonRefused(edges(edge("A", "B", "tail", "arrow"), edge("B", "A", "tail", "arrow")), null)
                .endsWith("bad.json, edge 2 (B, A): 'B' and 'A' are joined twice (also edge 1)"));
        assertTrue(jsonRefused(edges(edge("C", "C", "tail", "arrow")), null)
                .endsWith("bad.json, edge 1 (C, C): an edge from 'C' to itself (self-loop)"));
        assertTrue(jsonRefused(edges(edge("A", "B", "tail", "dot")), null)
                .endsWith("bad.json, edge 1 (A, B): unknown mark 'dot' (allowed: tail, arrow, circle)"));
        assertTrue(jsonRefused(edges(edge("A", "B", "tail", "arrow"), edge("B", "C", "tail", "arrow"),
                edge("C", "A", "tail", "arrow")), GraphClass.DAG)
                .endsWith("bad.json: the edges form a directed cycle (A -> B -> C -> A), but a DAG has none; remove or reverse one of its edges"));
        assertTrue(jsonRefused(edges(edge("A", "B", "tail", "arrow"), edge("B", "C", "tail", "arrow"),
                edge("C", "A", "tail", "arrow")), null).contains("the edges form a directed cycle (A -> B -> C -> A)"),
                "no class allows a directed cycle");
        assertTrue(jsonRefused(edges(edge("A", "B", "Tail", "arrow")), null)
                .endsWith("bad.json, edge 1 (A, B): unknown mark 'Tail' (allowed: tail, arrow, circle)"), "marks are lower case");
        assertTrue(jsonRefused("{\"variables\": [\"A\"], \"edges\": []} []", null)
                .contains("unexpected content after the end of the JSON object"));
        assertTrue(jsonRefused(edges(edge("A", "B", "tail", "tail")), GraphClass.DAG)
                .endsWith("bad.json, edge 1 (A, B): marks tail/tail are not allowed in a DAG"));
        assertTrue(jsonRefused(edges(edge("A", "B", "circle", "arrow")), GraphClass.CPDAG)
                .endsWith("marks circle/arrow are not allowed in a CPDAG"));
    }

    @Test
    void jsonShapeErrorsNameTheField() throws IOException {
        assertTrue(jsonRefused("{\"variables\": [\"A\"], \"edges\": [], \"colour\": 1}", null)
                .endsWith("bad.json, field 'colour': unknown field (allowed: variables, hidden, edges)"));
        assertTrue(jsonRefused("{\"variables\": [\"A\"]}", null)
                .endsWith("bad.json, field 'edges': missing (use [] for no edges)"));
        assertTrue(jsonRefused("{\"edges\": []}", null).endsWith("bad.json, field 'variables': missing"));
        assertTrue(jsonRefused("{\"variables\": [\"A\", \"A\"], \"edges\": []}", null)
                .endsWith("bad.json, field 'variables': variable 'A' is listed twice"));
        assertTrue(jsonRefused("{\"variables\": [\"A\"], \"hidden\": [\"B\"], \"edges\": []}", null)
                .endsWith("bad.json, field 'hidden': hidden variable 'B' is not among the variables"));
        assertTrue(jsonRefused(edges("{\"between\": [\"A\"], \"marks\": [\"tail\", \"arrow\"]}"), null)
                .endsWith("bad.json, edge 1, field 'between': expected exactly 2 entries, got 1"));
        assertTrue(jsonRefused(edges("{\"between\": [\"A\", \"B\"], \"marks\": [\"tail\", 3]}"), null)
                .endsWith("bad.json, edge 1, field 'marks': expected text, got 3"));
        assertTrue(jsonRefused(edges("{\"between\": [\"A\", \"B\"], \"marks\": [\"tail\", \"arrow\"], \"w\": 1}"), null)
                .endsWith("bad.json, edge 1: unknown field 'w' (allowed: between, marks)"));
        assertTrue(jsonRefused("{\"variables\": [\"A\"],\n \"edges\": [}", null)
                .contains("bad.json, line 2, column"));
        assertTrue(jsonRefused("", null).endsWith("bad.json: the file is empty (expected a JSON object with variables and edges)"));
        assertTrue(jsonRefused("{\"variables\": [\"A\"], \"variables\": [\"B\"], \"edges\": []}", null)
                .contains("Duplicate field 'variables'"));
    }

    // ---- CSV ----

    @Test
    void csvRoundTripWithTheVariableList() throws IOException {
        UniformRandomProvider rng = Seeds.random(6);
        for (int t = 0; t < 50; t++) {
            Graph g = randomGraph(rng);
            Path f = dir.resolve("r" + t + ".csv");
            if (t < 5) {
                GraphCsv.write(f, g);
            } else {
                try (var w = Files.newBufferedWriter(f)) {
                    GraphCsv.write(w, g);
                }
            }
            Graph back = GraphCsv.read(f, g.names(), null);
            assertTrue(g.sameEdges(back), "edge list loses only hidden flags");
            assertEquals(g.withHidden(Set.of()), back);
        }
    }

    @Test
    void csvTakesVariablesFromTheEdgesAfterTheGivenOnes() throws IOException {
        Path f = file("e.csv", "node_a,node_b,mark_a,mark_b\nrain,wet,tail,arrow\nsprinkler,wet,tail,arrow\n");
        Graph g = GraphCsv.readWithVariablesFromEdges(f, List.of("season"), GraphClass.DAG);
        assertEquals(List.of("season", "rain", "wet", "sprinkler"), g.names());
        assertTrue(g.hasDirected(g.index("sprinkler"), g.index("wet")));
        assertEquals(GraphCsv.HEADER, List.of(Files.readAllLines(f).get(0).split(",")));
    }

    private String csvRefused(String body, GraphClass expected) throws IOException {
        Path f = file("bad.csv", "node_a,node_b,mark_a,mark_b\n" + body);
        return assertThrows(FileFormatException.class, () -> GraphCsv.read(f, List.of("A", "B", "C"), expected))
                .getMessage();
    }

    @Test
    void csvErrorsNameFileLineAndEdge() throws IOException {
        assertTrue(csvRefused("A,B,tail,arrow\nA,Z,tail,arrow\n", null)
                .endsWith("bad.csv, line 3 (A, Z): unknown variable 'Z'"));
        assertTrue(csvRefused("A,B,tail,arrow\nB,A,arrow,tail\n", null)
                .endsWith("bad.csv, line 3 (B, A): 'B' and 'A' are joined twice (also line 2)"));
        assertTrue(csvRefused("B,B,tail,arrow\n", null).endsWith("bad.csv, line 2 (B, B): an edge from 'B' to itself (self-loop)"));
        assertTrue(csvRefused("A,B,tail,hook\n", null)
                .endsWith("bad.csv, line 2 (A, B): unknown mark 'hook' (allowed: tail, arrow, circle)"));
        assertTrue(csvRefused("A,B,arrow,tail\nA,C,tail,arrow\nC,B,tail,arrow\n", GraphClass.DAG)
                .endsWith("bad.csv: the edges form a directed cycle (A -> C -> B -> A), but a DAG has none; remove or reverse one of its edges"));
        assertTrue(csvRefused("A,B,tail\n", null).endsWith("bad.csv, line 2: the row has 3 cells but an edge needs 4 (node_a, node_b, mark_a, mark_b)"));
        Path noHeader = file("nh.csv", "a,b,tail,arrow\n");
        assertTrue(assertThrows(FileFormatException.class, () -> GraphCsv.read(noHeader, List.of("a", "b"), null))
                .getMessage().endsWith("nh.csv, line 1: expected the header node_a,node_b,mark_a,mark_b, got a,b,tail,arrow"));
        Path empty = file("empty.csv", "");
        assertTrue(assertThrows(FileFormatException.class, () -> GraphCsv.read(empty, List.of("a"), null))
                .getMessage().endsWith("empty.csv: the file is empty (expected the header node_a,node_b,mark_a,mark_b)"));
    }

    // ---- DOT ----

    @Test
    void dotDrawsEveryMarkAndStylesHiddenVariables() {
        String dot = GraphDot.toDot(sample(), "truth \"1\"");
        assertTrue(dot.startsWith("digraph \"truth \\\"1\\\"\" {\n"), dot);
        assertTrue(dot.contains("  \"A\" -> \"B\" [dir=both, arrowtail=none, arrowhead=normal];\n"), dot);
        assertTrue(dot.contains("  \"B\" -> \"C\" [dir=both, arrowtail=odot, arrowhead=normal];\n"), dot);
        assertTrue(dot.contains("  \"C\" -> \"D\" [dir=both, arrowtail=normal, arrowhead=normal];\n"), dot);
        assertTrue(dot.contains("  \"C\" [style=dashed"), dot);
        assertFalse(dot.contains("  \"A\" [style=dashed"), dot);
        assertTrue(dot.contains("  \"E\";\n"), "isolated variables are drawn too");
        assertTrue(dot.endsWith("}\n"));
    }

    @Test
    void dotIsWrittenAtomically() throws IOException {
        Path f = dir.resolve("g.dot");
        GraphDot.write(f, sample(), "g");
        assertEquals(GraphDot.toDot(sample(), "g"), Files.readString(f));
    }
}

package dev.touchstone.harness.cli;

import dev.touchstone.core.graph.Graph;
import dev.touchstone.harness.io.GraphFiles;
import dev.touchstone.harness.io.GraphJson;

import org.jgrapht.graph.DefaultEdge;
import org.jgrapht.graph.DirectedPseudograph;
import org.jgrapht.nio.dot.DOTImporter;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

import java.io.IOException;
import java.io.StringReader;
import java.nio.file.Files;
import java.nio.file.Path;

import static dev.touchstone.harness.cli.CliTest.cli;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

/** Graph files by name through {@code simulate}, {@code learn} and {@code score}. */
class GraphFormatsCliTest {

    @TempDir
    Path tmp;

    @Test
    void simulateLearnAndScoreInEveryFormat() throws IOException {
        Path sim = tmp.resolve("sim");
        CliTest.Result s = cli("simulate", "--graph", "erdos-renyi", "--set", "nodes=6", "--set", "mean_degree=2",
                "--samples", "400", "--seed", "5", "--graph-format", "csv,matrix.csv", "--graph-format", "dot",
                "--out", sim.toString());
        assertEquals(0, s.status(), s.err());
        Graph truth = GraphJson.read(sim.resolve("truth.json"));
        for (String name : new String[] {"truth.csv", "truth.matrix.csv", "truth.dot", "cpdag.dot", "pag.matrix.csv"}) {
            assertTrue(Files.isRegularFile(sim.resolve(name)), name);
        }
        assertEquals(truth, GraphFiles.read(sim.resolve("truth.matrix.csv"), null));
        assertEquals(truth, GraphFiles.read(sim.resolve("truth.dot"), null));

        Path dot = tmp.resolve("g.dot");
        CliTest.Result l = cli("learn", "--learner", "pc", "--data", sim.resolve("data.csv").toString(),
                "--out", dot.toString());
        assertEquals(0, l.status(), l.err());
        String text = Files.readString(dot);
        assertTrue(text.startsWith("digraph "), text);
        // Outside reader: JGraphT's DOTImporter; every arrow-tail pair it reads must be a directed edge of ours.
        Graph estimate = GraphFiles.read(dot, null);
        DirectedPseudograph<String, DefaultEdge> g = new DirectedPseudograph<>(null, DefaultEdge::new, false);
        DOTImporter<String, DefaultEdge> importer = new DOTImporter<>();
        importer.setVertexFactory(id -> id);
        importer.importGraph(g, new StringReader(text));
        assertEquals(estimate.edgeCount(), g.edgeSet().size());
        for (DefaultEdge e : g.edgeSet()) {
            int from = estimate.index(g.getEdgeSource(e));
            int to = estimate.index(g.getEdgeTarget(e));
            assertFalse(estimate.hasDirected(to, from), "JGraphT reads " + g.getEdgeSource(e) + " -> "
                    + g.getEdgeTarget(e) + " but the estimate points the other way");
        }

        Path matrix = tmp.resolve("g.matrix.csv");
        assertEquals(0, cli("learn", "--learner", "pc", "--data", sim.resolve("data.csv").toString(),
                "--out", matrix.toString()).status());
        CliTest.Result fromMatrix = cli("score", "--truth", sim.resolve("truth.dot").toString(),
                "--estimate", matrix.toString(), "--json");
        CliTest.Result fromDot = cli("score", "--truth", sim.resolve("truth.matrix.csv").toString(),
                "--estimate", dot.toString(), "--json");
        assertEquals(0, fromMatrix.status(), fromMatrix.err());
        assertEquals(fromMatrix.out().replaceAll("\"seconds\"[^,}]*", ""),
                fromDot.out().replaceAll("\"seconds\"[^,}]*", ""), "the same graphs score the same in any format");
    }

    @Test
    void unknownEndingsAreOneLineErrors() throws IOException {
        Path data = tmp.resolve("d.csv");
        Files.writeString(data, "a,b\n1,2\n2,3.5\n3,1\n");
        CliTest.Result l = cli("learn", "--learner", "pc", "--data", data.toString(), "--out",
                tmp.resolve("g.txt").toString());
        assertEquals(2, l.status());
        assertTrue(l.err().startsWith("error: " + tmp.resolve("g.txt") + ": cannot tell the graph format from the"
                + " name (accepted: .json graph JSON, .matrix.csv adjacency-matrix CSV, .csv CSV edge list,"
                + " .dot or .gv DOT)"), l.err());
        assertEquals(1, l.err().strip().lines().count(), l.err());
        CliTest.Result sc = cli("score", "--truth", tmp.resolve("t.graphml").toString(), "--estimate",
                tmp.resolve("e.json").toString());
        assertEquals(2, sc.status());
        assertTrue(sc.err().contains("cannot tell the graph format"), sc.err());
        CliTest.Result sim = cli("simulate", "--graph-format", "graphml", "--out", tmp.resolve("s").toString());
        assertEquals(2, sim.status());
        assertTrue(sim.err().contains("--graph-format: unknown format 'graphml' (allowed: json, csv, matrix.csv, dot)"),
                sim.err());
        assertFalse(Files.exists(tmp.resolve("s")), "nothing is written before the options are checked");
    }
}

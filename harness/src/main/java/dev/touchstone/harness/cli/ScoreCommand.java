package dev.touchstone.harness.cli;

import com.fasterxml.jackson.databind.ObjectMapper;
import com.fasterxml.jackson.databind.SerializationFeature;
import com.fasterxml.jackson.databind.node.ObjectNode;

import dev.touchstone.core.graph.Edge;
import dev.touchstone.core.graph.Graph;
import dev.touchstone.core.graph.GraphClass;
import dev.touchstone.core.graph.Mark;
import dev.touchstone.core.graph.algorithms.Ancestry;
import dev.touchstone.core.graph.algorithms.GraphChecks;
import dev.touchstone.harness.io.GraphFiles;
import dev.touchstone.metrics.scoring.Scorer;
import dev.touchstone.metrics.truth.Truth;
import dev.touchstone.metrics.truth.TruthSelection;

import picocli.CommandLine.Command;
import picocli.CommandLine.Option;
import picocli.CommandLine.Spec;
import picocli.CommandLine.Model.CommandSpec;

import java.io.IOException;
import java.io.PrintWriter;
import java.nio.file.Path;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.concurrent.Callable;

/**
 * {@code touchstone score}: compares one estimated graph with the true one and prints every
 * structural metric. Graph files are read in the format their name says
 * ({@link dev.touchstone.harness.io.GraphFormat}: JSON, CSV edge list, adjacency-matrix CSV, DOT). A true DAG is turned into the truth of the estimate's class (its CPDAG by
 * {@link Cpdags#of} for a CPDAG estimate); any other truth file must already be a graph
 * of the estimate's class. Cost: that of the metrics (O(V + E), plus the SID).
 */
@Command(name = "score",
        description = "Score an estimated graph against the true graph.")
public final class ScoreCommand implements Callable<Integer> {

    @Option(names = "--truth", required = true, paramLabel = "FILE", description = "The true graph (.json, .csv edge list, .matrix.csv, .dot or .gv).")
    Path truthFile;

    @Option(names = "--estimate", required = true, paramLabel = "FILE", description = "The estimated graph (.json, .csv edge list, .matrix.csv, .dot or .gv).")
    Path estimateFile;

    @Option(names = "--as", paramLabel = "CLASS",
            description = "What the estimate is: dag, cpdag or pag (default: the narrowest class its edges allow).")
    String as;

    @Option(names = "--json", description = "Print the values as JSON.")
    boolean json;

    @Spec
    CommandSpec spec;

    @Override
    public Integer call() throws IOException {
        GraphClass estimateClass = as == null ? null : parseClass(as);
        // An unknown extension is named before any file is opened.
        for (Path f : List.of(truthFile, estimateFile)) {
            dev.touchstone.harness.io.GraphFormat.of(f);
        }
        Graph truthGraph = GraphFiles.read(truthFile, null);
        Graph estimate = GraphFiles.read(estimateFile, truthGraph.names(), estimateClass);
        if (estimateClass == null) {
            estimateClass = narrowest(estimate);
        }
        Truth truth = truthFor(truthGraph, estimateClass);
        Map<String, Double> values;
        try {
            values = Scorer.scoreAll(truth, estimate, estimateClass);
        } catch (IllegalArgumentException e) {
            throw new UsageException(estimateFile + ": " + e.getMessage());
        }
        PrintWriter out = spec.commandLine().getOut();
        if (json) {
            ObjectMapper mapper = new ObjectMapper().enable(SerializationFeature.INDENT_OUTPUT);
            ObjectNode root = mapper.createObjectNode();
            root.put("estimate_class", estimateClass.word());
            root.put("truth_class", truth.referenceClass().word());
            ObjectNode metrics = root.putObject("metrics");
            values.forEach((k, v) -> {
                if (v == null) {
                    metrics.putNull(k);
                } else {
                    metrics.put(k, v);
                }
            });
            out.println(mapper.writeValueAsString(root));
        } else {
            out.printf(Locale.ROOT, "estimate as %s, scored against the true %s%n", estimateClass.word(),
                    truth.referenceClass().word());
            for (Map.Entry<String, Double> e : values.entrySet()) {
                out.printf(Locale.ROOT, "%-24s %s%n", e.getKey(), format(e.getValue()));
            }
        }
        out.flush();
        return Main.DONE;
    }

    private static GraphClass parseClass(String word) {
        for (GraphClass c : List.of(GraphClass.DAG, GraphClass.CPDAG, GraphClass.PAG)) {
            if (c.word().equals(word)) {
                return c;
            }
        }
        throw new UsageException("--as: unknown class '" + word + "' (allowed: dag, cpdag, pag)");
    }


    /** DAG when every edge is directed and acyclic, CPDAG when only tails and arrows (no ↔) occur, else PAG. */
    static GraphClass narrowest(Graph g) {
        if (g.isFullyDirected() && Ancestry.topologicalOrder(g) != null) {
            return GraphClass.DAG;
        }
        for (Edge e : g.edges()) {
            if (!GraphClass.CPDAG.allows(e)) {
                return GraphClass.PAG;
            }
        }
        return GraphClass.CPDAG;
    }

    private Truth truthFor(Graph t, GraphClass estimateClass) {
        boolean isDag = t.isFullyDirected() && Ancestry.topologicalOrder(t) != null;
        if (isDag) {
            // A generating DAG (hidden variables flagged) gives the truth of the estimate's class (TruthSelection).
            try {
                return TruthSelection.forEstimate(t, estimateClass);
            } catch (IllegalArgumentException e) {
                throw new UsageException(truthFile + ": " + e.getMessage());
            }
        }
        for (Edge e : t.edges()) {
            if (!estimateClass.allows(e)) {
                throw new UsageException(truthFile + ": the truth has the edge " + t.name(e.a()) + " " + e.atA().word()
                        + "/" + e.atB().word() + " " + t.name(e.b()) + ", which a " + estimateClass.word()
                        + " cannot have; give the true " + estimateClass.word() + " or a true DAG");
            }
        }
        if (estimateClass == GraphClass.CPDAG) {
            try {
                GraphChecks.checkCpdag(t);
            } catch (IllegalArgumentException e) {
                throw new UsageException(truthFile + ": " + e.getMessage() + "; give the true CPDAG or a true DAG");
            }
        }
        if (estimateClass == GraphClass.PAG) {
            for (Edge e : t.edges()) {
                // Truths come from DAGs with hidden variables and no selection: a PAG of one has a
                // tail only on a directed edge (Zhang 2008, §3; tails elsewhere need selection).
                boolean tail = e.atA() == Mark.TAIL || e.atB() == Mark.TAIL;
                if (tail && !e.isDirected()) {
                    throw new UsageException(truthFile + ": the truth has the edge " + t.name(e.a()) + " "
                            + e.atA().word() + "/" + e.atB().word() + " " + t.name(e.b()) + ", but a true PAG of a"
                            + " DAG with hidden variables has tails only on directed edges; give the true PAG or a true DAG");
                }
            }
        }
        return Truth.of(t, estimateClass);
    }

    private static String format(Double v) {
        if (v == null) {
            return "n/a";
        }
        if (v == Math.rint(v) && Math.abs(v) < 1e15) {
            return Long.toString(v.longValue());
        }
        return String.format(Locale.ROOT, "%.4f", v);
    }
}

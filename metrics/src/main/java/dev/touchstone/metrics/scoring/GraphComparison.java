package dev.touchstone.metrics.scoring;

import dev.touchstone.core.graph.Edge;
import dev.touchstone.core.graph.Graph;
import dev.touchstone.core.graph.GraphClass;
import dev.touchstone.core.graph.Mark;
import dev.touchstone.core.graph.MutableGraph;
import dev.touchstone.metrics.sid.SidResult;
import dev.touchstone.metrics.sid.StructuralInterventionDistance;
import dev.touchstone.metrics.truth.Truth;

import java.util.ArrayList;
import java.util.LinkedHashSet;
import java.util.List;
import java.util.Objects;
import java.util.Set;

/**
 * One estimate set against its truth, with the shared counts every structural metric reads.
 *
 * <p>Building one checks the input: both graphs must be over the same variables (in any order;
 * the estimate is re-indexed in the truth's order), and every estimated edge must be allowed in
 * the estimate's declared class. The counts cost O(p + E); the structural intervention distance,
 * much dearer, is computed on first use and kept. Not thread-safe for that first use; share a
 * comparison across threads only after reading {@link #sid()}.
 */
public final class GraphComparison {

    private final Truth truth;
    private final Graph estimate;
    private final GraphClass estimateClass;
    private final EdgeCounts counts;
    private SidResult sid;
    private boolean sidDone;

    private GraphComparison(Truth truth, Graph estimate, GraphClass estimateClass) {
        this.truth = truth;
        this.estimate = estimate;
        this.estimateClass = estimateClass;
        this.counts = EdgeCounts.of(truth.reference(), estimate);
    }

    /**
     * Sets an estimate against a truth.
     *
     * @throws IllegalArgumentException when the variables differ (naming the names that differ)
     *                                  or an estimated edge is not allowed in {@code estimateClass}
     */
    public static GraphComparison of(Truth truth, Graph estimate, GraphClass estimateClass) {
        Objects.requireNonNull(truth, "truth");
        Objects.requireNonNull(estimate, "estimate");
        Objects.requireNonNull(estimateClass, "estimateClass");
        Graph aligned = align(truth.reference(), estimate);
        // which (mark here, mark there) pairs the class allows, so the check allocates nothing per edge
        Mark[] marks = Mark.values();
        boolean[][] allowed = new boolean[marks.length][marks.length];
        for (Mark here : marks) {
            for (Mark there : marks) {
                allowed[here.ordinal()][there.ordinal()] = estimateClass.allows(new Edge(0, 1, here, there));
            }
        }
        for (int v = 0; v < aligned.size(); v++) {
            for (int k = 0, d = aligned.degree(v); k < d; k++) {
                if (!allowed[aligned.markHere(v, k).ordinal()][aligned.markThere(v, k).ordinal()]) {
                    Edge e = aligned.edge(v, aligned.neighbour(v, k)).canonical();
                    throw new IllegalArgumentException("the estimate declared as " + estimateClass.word() + " has the edge "
                            + describe(aligned, e) + ", which a " + estimateClass.word() + " cannot have");
                }
            }
        }
        return new GraphComparison(truth, aligned, estimateClass);
    }

    /** The estimate over the truth's variables in the truth's order; refuses different variable sets. */
    static Graph align(Graph reference, Graph estimate) {
        if (reference.names().equals(estimate.names())) {
            return estimate;
        }
        Set<String> onlyEstimate = new LinkedHashSet<>(estimate.names());
        onlyEstimate.removeAll(reference.names());
        Set<String> onlyTruth = new LinkedHashSet<>(reference.names());
        onlyTruth.removeAll(estimate.names());
        if (!onlyEstimate.isEmpty() || !onlyTruth.isEmpty()) {
            List<String> parts = new ArrayList<>();
            if (!onlyTruth.isEmpty()) {
                parts.add("only in the truth: " + String.join(", ", onlyTruth));
            }
            if (!onlyEstimate.isEmpty()) {
                parts.add("only in the estimate: " + String.join(", ", onlyEstimate));
            }
            throw new IllegalArgumentException("the estimate and the truth are over different variables ("
                    + String.join("; ", parts) + ")");
        }
        MutableGraph g = Graph.builder(reference.names());
        int[] to = new int[estimate.size()];
        for (int v = 0; v < estimate.size(); v++) {
            to[v] = reference.index(estimate.name(v));
        }
        for (Edge e : estimate.edges()) {
            g.addEdge(to[e.a()], to[e.b()], e.atA(), e.atB());
        }
        return g.freeze();
    }

    private static String describe(Graph g, Edge e) {
        return g.name(e.a()) + " " + e.atA().word() + "-" + e.atB().word() + " " + g.name(e.b());
    }

    /** The truth. */
    public Truth truth() {
        return truth;
    }

    /** The estimate, over the truth's variables in the truth's order. */
    public Graph estimate() {
        return estimate;
    }

    /** The class the learner declared for the estimate. */
    public GraphClass estimateClass() {
        return estimateClass;
    }

    /** The shared edge and endpoint counts. */
    public EdgeCounts counts() {
        return counts;
    }

    /**
     * The structural intervention distance and its bounds, or null when it is undefined here:
     * the truth has no DAG behind it (something is hidden, or it was given as another class),
     * or the estimate is neither a DAG nor a CPDAG.
     */
    public SidResult sid() {
        if (!sidDone) {
            if (truth.dag() != null && (estimateClass == GraphClass.DAG || estimateClass == GraphClass.CPDAG)) {
                sid = StructuralInterventionDistance.between(truth.dag(), estimate);
            }
            sidDone = true;
        }
        return sid;
    }
}

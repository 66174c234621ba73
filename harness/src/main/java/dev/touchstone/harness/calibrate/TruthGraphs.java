package dev.touchstone.harness.calibrate;

import dev.touchstone.core.data.DataSet;
import dev.touchstone.core.graph.Edge;
import dev.touchstone.core.graph.Graph;
import dev.touchstone.core.graph.GraphClass;
import dev.touchstone.core.graph.MutableGraph;
import dev.touchstone.core.graph.algorithms.Ancestry;
import dev.touchstone.core.graph.algorithms.DagExtension;
import dev.touchstone.core.knowledge.Knowledge;
import dev.touchstone.core.learner.Estimate;
import dev.touchstone.core.learner.LearnerInput;
import dev.touchstone.core.learner.RunContext;
import dev.touchstone.core.random.Seeds;

import java.time.Duration;
import java.util.HashSet;
import java.util.List;

/**
 * Where the calibration's truth DAG comes from: a graph the analyst gives (re-indexed to
 * the data's column order), or one learned from the data by a chosen learner — a CPDAG is
 * turned into one of its DAGs by the consistent extension of Dor and Tarsi (1992). Cost:
 * O(p + edges), or the learner's run.
 */
public final class TruthGraphs {

    private TruthGraphs() {
    }

    /**
     * The given DAG over the data's variables, in the data's column order.
     *
     * @param source names the file in messages
     * @throws IllegalArgumentException when the variables differ or the graph is not a DAG
     */
    public static Graph given(Graph g, DataSet data, String source) {
        if (!new HashSet<>(g.names()).equals(new HashSet<>(data.names()))) {
            throw new IllegalArgumentException(source + ": the graph's variables " + g.names()
                    + " are not the data's columns " + data.names());
        }
        MutableGraph out = Graph.builder(data.names());
        for (Edge e : g.edges()) {
            if (!e.isDirected()) {
                throw new IllegalArgumentException(source + ": the edge between '" + g.name(e.a()) + "' and '"
                        + g.name(e.b()) + "' is not directed; the truth graph must be a DAG");
            }
            int from = e.tail();
            out.addDirected(out.indexOf(g.name(from)), out.indexOf(g.name(e.other(from))));
        }
        Graph dag = out.freeze();
        if (!Ancestry.isAcyclic(dag)) {
            throw new IllegalArgumentException(source + ": the graph has a directed cycle; the truth graph must be"
                    + " a DAG");
        }
        return dag;
    }

    /**
     * A DAG learned from the data by {@code choice} (seeded), turned into a DAG when it is a
     * CPDAG.
     *
     * @throws IllegalArgumentException when the learner returns a class other than DAG or
     *     CPDAG, or a CPDAG with no consistent extension (the message reads after the learner's id)
     */
    public static Graph learned(CalibrationSettings.Choice choice, DataSet data, long seed, Duration limit) {
        LearnerInput input = LearnerInput.of(data);
        choice.learner().description().checkAccepts(input);
        RunContext context = RunContext.of(Seeds.derive(seed, "truth-learner", choice.id()), limit, 1);
        Estimate e = choice.learner().learn(input, Knowledge.none(), choice.values(), context);
        if (e.graphClass() == GraphClass.DAG) {
            return e.graph();
        }
        if (e.graphClass() != GraphClass.CPDAG) {
            throw new IllegalArgumentException("it returns a " + e.graphClass().word()
                    + "; choose a learner that returns a DAG or CPDAG, or give --graph");
        }
        Graph dag = DagExtension.of(e.graph());
        if (dag == null) {
            throw new IllegalArgumentException("the CPDAG it learned has no DAG extension (conflicting"
                    + " orientations); choose another truth learner or give --graph");
        }
        return dag;
    }

    /** The edges of a DAG as "a → b" lines, for reports. */
    public static List<String> edgeLines(Graph dag) {
        java.util.List<String> out = new java.util.ArrayList<>();
        for (Edge e : dag.edges()) {
            int from = e.tail();
            out.add(dag.name(from) + " → " + dag.name(e.other(from)));
        }
        return out;
    }
}

package dev.touchstone.learners.score;

import dev.touchstone.core.graph.Edge;
import dev.touchstone.core.graph.Graph;
import dev.touchstone.core.graph.MutableGraph;
import dev.touchstone.core.graph.algorithms.Ancestry;
import dev.touchstone.core.graph.algorithms.DagExtension;
import dev.touchstone.core.knowledge.Knowledge;
import dev.touchstone.core.learner.LearnerException;

import java.util.List;
import java.util.Optional;

/**
 * The DAG a search over DAGs starts from: the empty graph, or the input's start graph, in
 * both cases holding every required edge. A partially directed start graph (such as a
 * CPDAG) is first extended to a DAG with the same skeleton and v-structures by the
 * algorithm of Dor and Tarsi (1992, see {@link DagExtension}), so a search handed the
 * estimate of another learner starts from a member of the class that learner found.
 *
 * <p>A start graph the knowledge contradicts is refused rather than repaired: silently
 * dropping or turning edges would start the search somewhere the user did not ask for.
 */
final class StartDag {

    private StartDag() {
    }

    /**
     * The starting DAG.
     *
     * @throws LearnerException naming the edge when the start graph has an edge other than
     *     directed or undirected, has no DAG extension, or contradicts the knowledge
     */
    static Pdag of(Optional<Graph> start, List<String> names, Knowledge knowledge) {
        MutableGraph dag = start.map(StartDag::extension).orElseGet(() -> Graph.builder(names));
        for (Knowledge.DirectedPair r : knowledge.required()) {
            int from = dag.indexOf(r.from());
            int to = dag.indexOf(r.to());
            if (dag.hasDirected(to, from)) {
                throw new LearnerException("the start graph has " + r.to() + " -> " + r.from()
                        + ", the reverse of a required edge");
            }
            if (!dag.adjacent(from, to)) {
                dag.addDirected(from, to);
            }
        }
        Graph frozen = dag.freeze();
        if (start.isPresent()) {
            for (Edge e : frozen.edges()) {
                int from = e.tail();
                int to = e.other(from);
                if (knowledge.isForbidden(frozen.name(from), frozen.name(to))) {
                    throw new LearnerException("the start graph has " + frozen.name(from) + " -> " + frozen.name(to)
                            + ", which the knowledge forbids");
                }
            }
            if (!knowledge.required().isEmpty() && !Ancestry.isAcyclic(frozen)) {
                throw new LearnerException("the start graph with the required edges added has a directed cycle");
            }
        }
        return Pdag.of(frozen);
    }

    private static MutableGraph extension(Graph start) {
        for (Edge e : start.edges()) {
            if (!e.isDirected() && !e.isUndirected()) {
                throw new LearnerException("a start graph may have only directed and undirected edges; it has "
                        + start.name(e.a()) + " " + e.atA().word() + "/" + e.atB().word() + " " + start.name(e.b()));
            }
        }
        Graph dag = DagExtension.of(start);
        if (dag == null) {
            throw new LearnerException("the start graph has no DAG extension (Dor and Tarsi 1992): its directed edges"
                    + " form a cycle, or orienting its undirected edges cannot avoid a cycle or a new v-structure");
        }
        return dag.toMutable();
    }
}

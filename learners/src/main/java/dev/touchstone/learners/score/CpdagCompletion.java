package dev.touchstone.learners.score;

import dev.touchstone.core.graph.Graph;
import dev.touchstone.core.graph.algorithms.Cpdags;
import dev.touchstone.core.graph.algorithms.DagExtension;
import dev.touchstone.core.graph.algorithms.MeekRules;
import dev.touchstone.core.knowledge.Knowledge;

import java.util.List;

/**
 * Re-completes the PDAG left by a GES move with core's graph algorithms: a consistent DAG
 * extension ({@link DagExtension}, Dor and Tarsi 1992), the CPDAG of that DAG
 * ({@link Cpdags}, Chickering 1995), then — only when there is background knowledge — the
 * orientations the knowledge demands closed under Meek's rules R1–R4 ({@link MeekRules},
 * Meek 1995). Cost: that of the three core algorithms, about O(p + |E|·Δ) on sparse graphs,
 * plus two conversions between {@link Pdag} and {@link Graph}, O(p + |E|) (and O(p²) bytes
 * for the new edge-state table).
 */
final class CpdagCompletion implements GesSearch.Completion {

    private final List<String> names;
    private final Knowledge knowledge;

    CpdagCompletion(List<String> names, Knowledge knowledge) {
        this.names = names;
        this.knowledge = knowledge;
    }

    @Override
    public Pdag complete(Pdag pdag) {
        Graph dag = DagExtension.of(pdag.toGraph(names));
        if (dag == null) {
            throw new IllegalStateException("the PDAG after a GES move has no consistent extension");
        }
        return Pdag.of(classOf(dag, knowledge));
    }

    /** The CPDAG of {@code dag}, with the orientations knowledge demands closed under Meek's rules. */
    static Graph classOf(Graph dag, Knowledge knowledge) {
        Graph cpdag = Cpdags.of(dag);
        return knowledge.isEmpty() ? cpdag : MeekRules.apply(cpdag, knowledge);
    }

    @Override
    public Pdag extend(Pdag pdag) {
        Graph dag = DagExtension.of(pdag.toGraph(names));
        return dag == null ? null : Pdag.of(dag);
    }
}

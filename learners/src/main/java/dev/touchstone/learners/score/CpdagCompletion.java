package dev.touchstone.learners.score;

import dev.touchstone.core.graph.Graph;
import dev.touchstone.core.graph.algorithms.Cpdags;
import dev.touchstone.core.graph.algorithms.MeekRules;
import dev.touchstone.core.knowledge.Knowledge;

import java.util.List;

/**
 * Re-completes the PDAG left by a GES move: a consistent DAG extension (Dor and Tarsi 1992)
 * and the CPDAG of that DAG (Chickering 1995), both computed on the {@link Pdag} itself by
 * {@link CompletionRows}, then — only when there is background knowledge — the orientations
 * the knowledge demands closed under Meek's rules R1–R4 ({@link MeekRules}, Meek 1995), which
 * goes through core's {@link Graph}. Without knowledge no core graph is built, because a
 * search at p = 1,000 makes thousands of moves and, through core, most of each completion's
 * time went into building, freezing and converting graphs (and their name indexes) rather
 * than into the two algorithms. Cost about O(p + |E|·Δ log Δ) on sparse graphs.
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
        Pdag cpdag = CompletionRows.cpdagOf(pdag);
        if (cpdag == null) {
            throw new IllegalStateException("the PDAG after a GES move has no consistent extension");
        }
        return knowledge.isEmpty() ? cpdag : Pdag.of(MeekRules.apply(cpdag.toGraph(names), knowledge));
    }

    /** The CPDAG of {@code dag}, with the orientations knowledge demands closed under Meek's rules. */
    static Graph classOf(Graph dag, Knowledge knowledge) {
        Graph cpdag = Cpdags.of(dag);
        return knowledge.isEmpty() ? cpdag : MeekRules.apply(cpdag, knowledge);
    }

    @Override
    public Pdag extend(Pdag pdag) {
        return CompletionRows.extensionOf(pdag);
    }
}

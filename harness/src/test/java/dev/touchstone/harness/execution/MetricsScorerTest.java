package dev.touchstone.harness.execution;

import dev.touchstone.core.graph.Graph;
import dev.touchstone.core.graph.GraphClass;
import dev.touchstone.core.graph.MutableGraph;
import dev.touchstone.core.learner.Estimate;
import dev.touchstone.harness.study.Study;
import dev.touchstone.metrics.against.MetricAgainst;
import org.junit.jupiter.api.DisplayName;
import org.junit.jupiter.api.Test;

import java.util.List;
import java.util.Map;
import java.util.Set;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertNull;
import static org.junit.jupiter.api.Assertions.assertTrue;

/** Extra truths of a study's score_against, on hand-worked examples. */
class MetricsScorerTest {

    private static Graph chain(Set<String> hidden) {
        MutableGraph g = Graph.builder(List.of("a", "b", "c"));
        g.addDirected(0, 1);
        g.addDirected(1, 2);
        return g.freeze().withHidden(hidden);
    }

    @Test
    @DisplayName("a DAG estimate equal to the true chain a→b→c: SHD 0 against the DAG, 2 against its CPDAG a—b—c")
    void dagEstimateAgainstTheCpdag() {
        // By hand, with the SHD of Tsamardinos, Brown and Aliferis (2006) as docs/dev/metrics.md defines it (each pair whose
        // marks differ counts once): the chain's CPDAG leaves both edges undirected (no v-structure; Meek 1995),
        // so the directed estimate differs from it on both pairs.
        Graph dag = chain(Set.of());
        Scorer.Scored s = new MetricsScorer().score(new Replicate(dag, null, null), Estimate.of(dag, GraphClass.DAG),
                List.of("shd", "shd_vs_cpdag", "shd_vs_dag", "adjacency_f1_vs_cpdag"));
        assertEquals(GraphClass.DAG, s.scoredAgainst());
        assertEquals(0.0, s.values().get("shd"));
        assertEquals(0.0, s.values().get("shd_vs_dag"));
        assertEquals(2.0, s.values().get("shd_vs_cpdag"));
        assertEquals(1.0, s.values().get("adjacency_f1_vs_cpdag"), "the skeleton is the same");
    }

    @Test
    @DisplayName("with a hidden variable there is no true CPDAG over the observed ones: those values are undefined, not 0")
    void hiddenMakesTheCpdagUndefined() {
        Graph dag = chain(Set.of("b"));
        Graph observed = Graph.builder(List.of("a", "c")).addDirected(0, 1).freeze();
        Map<String, Double> v = new MetricsScorer().score(new Replicate(dag, null, null),
                Estimate.of(observed, GraphClass.DAG), List.of("shd_vs_cpdag", "shd_vs_mag")).values();
        assertTrue(v.containsKey("shd_vs_cpdag"));
        assertNull(v.get("shd_vs_cpdag"));
        // The MAG of a→(b)→c with b hidden is a→c (latent projection, Richardson and Spirtes 2002): SHD 0.
        assertEquals(0.0, v.get("shd_vs_mag"));
    }

    @Test
    @DisplayName("extra metric names: METRIC_vs_CLASS, and plain names are not extra")
    void names() {
        assertEquals(new MetricAgainst("adjacency_f1", GraphClass.PAG), MetricAgainst.parse("adjacency_f1_vs_pag"));
        assertNull(MetricAgainst.parse("shd"));
        assertNull(MetricAgainst.parse("shd_vs_tree"));
        assertEquals(List.of("shd", "seconds", "shd_vs_cpdag"),
                Study.withScoreAgainst(List.of("shd", "seconds"), List.of(GraphClass.CPDAG)));
    }
}

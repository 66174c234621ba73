package dev.touchstone.metrics.scoring;

import dev.touchstone.core.graph.Graph;
import dev.touchstone.core.graph.GraphClass;
import dev.touchstone.core.graph.Mark;
import dev.touchstone.core.graph.MutableGraph;
import dev.touchstone.metrics.truth.Truth;
import org.junit.jupiter.api.DisplayName;
import org.junit.jupiter.api.Test;

import java.util.List;
import java.util.Map;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertNull;
import static org.junit.jupiter.api.Assertions.assertTrue;

/** Every metric on small graphs worked out by hand; the reasoning is written beside each value. */
class HandWorkedMetricsTest {

    private static final double EPS = 1e-12;

    @Test
    @DisplayName("DAG against DAG: one reversed, one missing, one extra edge (Tsamardinos, Brown and Aliferis 2006 for SHD; Zheng et al. 2018 for the directed rates)")
    void dagAgainstDag() {
        List<String> v = List.of("A", "B", "C", "D");
        Graph truth = Graph.builder(v).addDirected(0, 1).addDirected(1, 2).addDirected(2, 3).freeze(); // A→B→C→D
        Graph est = Graph.builder(v).addDirected(0, 1).addDirected(2, 1).addDirected(0, 3).freeze();  // A→B, C→B, A→D
        Map<String, Double> m = Scorer.scoreAll(Truth.of(truth, GraphClass.DAG), est, GraphClass.DAG);

        // SHD: {B,C} reoriented, {C,D} removed, {A,D} added: 3 (each counts one).
        assertEquals(3.0, m.get("shd"));
        // Adjacencies: {A,B} and {B,C} are in both; 3 estimated, 3 true.
        assertEquals(2.0 / 3, m.get("adjacency_precision"), EPS);
        assertEquals(2.0 / 3, m.get("adjacency_recall"), EPS);
        assertEquals(2.0 / 3, m.get("adjacency_f1"), EPS);
        // Arrowheads. True: at B (A→B), C (B→C), D (C→D). Estimated: at B (A→B), at B (C→B), at D (A→D).
        // Correct: only B on {A,B}; B on {B,C} has the truth's arrow at C; D on {A,D} is on a non-adjacent pair.
        assertEquals(1.0 / 3, m.get("orientation_precision"), EPS);
        assertEquals(1.0 / 3, m.get("orientation_recall"), EPS);
        assertEquals(1.0 / 3, m.get("orientation_f1"), EPS);
        // Zheng et al.: TP = {A→B} = 1; reversed = {C→B} = 1; false positive = {A→D} = 1;
        // TPR = 1/3 true edges; FDR = (1 + 1)/3 predicted; FPR = (1 + 1)/(4·3/2 − 3) = 2/3.
        assertEquals(1.0 / 3, m.get("directed_tpr"), EPS);
        assertEquals(2.0 / 3, m.get("directed_fdr"), EPS);
        assertEquals(2.0 / 3, m.get("directed_fpr"), EPS);
        // SID (Peters and Bühlmann 2015) with Pa_H: A ∅, B {A,C}, C ∅, D {A}:
        //  i = A: root of G, ∅ is valid for every j → 0.
        //  i = B: C ∈ Pa_H(B) but C descends from B → wrong; D: C ∈ Z lies on the causal path B→C→D → wrong;
        //         A ∈ Pa_H(B) and A does not descend from B → right. 2.
        //  i = C: A and B are not descendants and ∅ leaves C←B←A open → 2 wrong; D: only C→D, ∅ valid. 2.
        //  i = D: Z = {A}; A is no descendant → right; B, C reach D through D←C←B unblocked by {A} → 2 wrong.
        // SID = 0 + 2 + 2 + 2 = 6, both bounds too (a DAG).
        assertEquals(6.0, m.get("sid"));
        assertEquals(6.0, m.get("sid_lower"));
        assertEquals(6.0, m.get("sid_upper"));
        assertEquals(0.0, m.get("exact"));
        assertEquals(3.0, m.get("edges"));
        // Skeleton FPR (Kalisch and Bühlmann 2007): 6 pairs, 3 true, so 3 non-adjacent in the truth;
        // of those the estimate joins {A,D} only: 1/3.
        assertEquals(1.0 / 3, m.get("adjacency_fpr"), EPS);
        // Wrong arrowheads: 3 estimated, 1 correct (B on {A,B}): 2. A DAG has no undirected edge.
        assertEquals(2.0, m.get("wrong_arrowheads"));
        assertEquals(0.0, m.get("undirected_edges"));
        // tails are scored for MAG and PAG estimates only
        assertNull(m.get("tail_precision"));
        assertNull(m.get("tail_recall"));
    }

    @Test
    @DisplayName("CPDAG against CPDAG: Pearl's sprinkler CPDAG (Pearl 2000, ch. 1) with undirected edges scored as Zheng et al. 2018 say")
    void cpdagAgainstCpdag() {
        // season 0, sprinkler 1, rain 2, wet 3, slippery 4
        List<String> v = List.of("season", "sprinkler", "rain", "wet", "slippery");
        Graph dag = Graph.builder(v).addDirected(0, 1).addDirected(0, 2).addDirected(1, 3).addDirected(2, 3)
                .addDirected(3, 4).freeze();
        Graph cpdag = Graph.builder(v).addUndirected(0, 1).addUndirected(0, 2).addDirected(1, 3).addDirected(2, 3)
                .addDirected(3, 4).freeze();
        Graph est = Graph.builder(v).addUndirected(0, 1).addDirected(0, 2).addDirected(1, 3).addUndirected(2, 3)
                .addDirected(4, 3).addUndirected(1, 2).freeze();
        Map<String, Double> m = Scorer.scoreAll(new Truth(cpdag, GraphClass.CPDAG, dag), est, GraphClass.CPDAG);

        // SHD: {season,rain} marks differ, {rain,wet} marks differ, {wet,slippery} reversed, {sprinkler,rain} added: 4.
        assertEquals(4.0, m.get("shd"));
        // Adjacencies: all 5 true pairs found, 6 estimated.
        assertEquals(5.0 / 6, m.get("adjacency_precision"), EPS);
        assertEquals(1.0, m.get("adjacency_recall"), EPS);
        assertEquals(10.0 / 11, m.get("adjacency_f1"), EPS);
        // Arrowheads. True: wet (×2, from sprinkler and rain), slippery. Estimated: rain (season→rain), wet (sprinkler→wet),
        // wet (slippery→wet). Correct: wet on {sprinkler,wet} only. Undirected edges carry none.
        assertEquals(1.0 / 3, m.get("orientation_precision"), EPS);
        assertEquals(1.0 / 3, m.get("orientation_recall"), EPS);
        assertEquals(1.0 / 3, m.get("orientation_f1"), EPS);
        // Zheng et al.: on true pairs, season—sprinkler and rain—wet (undirected) are favourable hits; season→rain and
        // sprinkler→wet put their tail where the truth has no arrowhead: hits; slippery→wet is reversed.
        // TP = 4, reversed = 1, false positive = sprinkler—rain. TPR = 4/5, FDR = 2/6, FPR = 2/(10 − 5).
        assertEquals(4.0 / 5, m.get("directed_tpr"), EPS);
        assertEquals(2.0 / 6, m.get("directed_fdr"), EPS);
        assertEquals(2.0 / 5, m.get("directed_fpr"), EPS);
        // a CPDAG stands for several DAGs: sid itself is for DAG estimates only; the bounds are defined
        assertNull(m.get("sid"));
        assertTrue(m.get("sid_lower") <= m.get("sid_upper"));
        assertEquals(0.0, m.get("exact"));
        assertEquals(6.0, m.get("edges"));
        // Skeleton FPR: 10 pairs, 5 true, 5 non-adjacent; the estimate joins sprinkler—rain only: 1/5.
        assertEquals(1.0 / 5, m.get("adjacency_fpr"), EPS);
        // Wrong arrowheads: rain (season→rain; truth undirected) and wet on {wet,slippery} (truth's arrow at slippery): 2.
        assertEquals(2.0, m.get("wrong_arrowheads"));
        // Undirected: season—sprinkler, rain—wet, sprinkler—rain: 3.
        assertEquals(3.0, m.get("undirected_edges"));
    }

    @Test
    @DisplayName("SID bounds of the CPDAG A—B against the DAG A→B are 0 and 2, the SIDs of its two members (Peters and Bühlmann 2015)")
    void sidBoundsOfOneUndirectedEdge() {
        List<String> v = List.of("A", "B");
        Graph dag = Graph.builder(v).addDirected(0, 1).freeze();
        Graph est = Graph.builder(v).addUndirected(0, 1).freeze();
        // A's parent set may be ∅ (valid: A is a root; 0 wrong) or {B} (B descends from A: 1 wrong);
        // B's may be ∅ (A and B adjacent, not separated: 1 wrong) or {A} (A is no descendant of B: 0 wrong).
        // lower = 0 + 0, upper = 1 + 1.
        Map<String, Double> m = Scorer.scoreAll(Truth.of(dag, GraphClass.DAG), est, GraphClass.CPDAG);
        assertEquals(0.0, m.get("sid_lower"));
        assertEquals(2.0, m.get("sid_upper"));
    }

    @Test
    @DisplayName("PAG against PAG: arrowheads and tails with circles (endpoint definitions of docs/dev/metrics.md)")
    void pagAgainstPag() {
        List<String> v = List.of("A", "B", "C", "D");
        MutableGraph t = Graph.builder(v);
        t.addEdge(0, 1, Mark.CIRCLE, Mark.ARROW);   // A o-> B
        t.addEdge(2, 1, Mark.CIRCLE, Mark.ARROW);   // C o-> B
        t.addEdge(1, 3, Mark.TAIL, Mark.ARROW);     // B --> D
        MutableGraph e = Graph.builder(v);
        e.addEdge(0, 1, Mark.CIRCLE, Mark.ARROW);   // A o-> B (same)
        e.addEdge(2, 1, Mark.ARROW, Mark.ARROW);    // C <-> B
        e.addEdge(1, 3, Mark.CIRCLE, Mark.ARROW);   // B o-> D
        e.addEdge(0, 3, Mark.TAIL, Mark.ARROW);     // A --> D (added)
        Map<String, Double> m = Scorer.scoreAll(Truth.of(t.freeze(), GraphClass.PAG), e.freeze(), GraphClass.PAG);

        // SHD: {B,C} and {B,D} marks differ, {A,D} added: 3.
        assertEquals(3.0, m.get("shd"));
        assertEquals(3.0 / 4, m.get("adjacency_precision"), EPS);
        assertEquals(1.0, m.get("adjacency_recall"), EPS);
        assertEquals(6.0 / 7, m.get("adjacency_f1"), EPS);
        // Arrowheads. True: B {A,B}, B {B,C}, D {B,D}. Estimated: B {A,B} ✓, B {B,C} ✓, C {B,C} ✗ (truth: circle),
        // D {B,D} ✓, D {A,D} ✗ (pair not adjacent in the truth). Precision 3/5, recall 3/3, F1 6/8.
        assertEquals(3.0 / 5, m.get("orientation_precision"), EPS);
        assertEquals(1.0, m.get("orientation_recall"), EPS);
        assertEquals(0.75, m.get("orientation_f1"), EPS);
        // Tails. True: B on {B,D}. Estimated: A on {A,D}, a pair the truth does not join. 0/1 and 0/1.
        assertEquals(0.0, m.get("tail_precision"));
        assertEquals(0.0, m.get("tail_recall"));
        // directed rates and SID are defined for DAG and CPDAG estimates only
        assertNull(m.get("directed_tpr"));
        assertNull(m.get("sid_lower"));
        assertEquals(0.0, m.get("exact"));
        assertEquals(4.0, m.get("edges"));
        // Skeleton FPR: 6 pairs, 3 true, 3 non-adjacent; {A,D} added: 1/3. Wrong arrowheads: C on {B,C}, D on {A,D}: 2.
        assertEquals(1.0 / 3, m.get("adjacency_fpr"), EPS);
        assertEquals(2.0, m.get("wrong_arrowheads"));
        // circles are not tails: undirected_edges is declared for DAG and CPDAG estimates only
        assertNull(m.get("undirected_edges"));
    }

    @Test
    @DisplayName("undefined ratios are null, never 0 or 1; equal graphs are exact with SHD 0")
    void undefinedRatios() {
        List<String> v = List.of("A", "B", "C");
        Graph empty = Graph.empty(v);
        Map<String, Double> m = Scorer.scoreAll(Truth.of(empty, GraphClass.DAG), empty, GraphClass.DAG);
        assertNull(m.get("adjacency_precision"));   // 0/0 estimated
        assertNull(m.get("adjacency_recall"));      // 0/0 true
        assertNull(m.get("adjacency_f1"));          // 0/(0 + 0)
        assertNull(m.get("orientation_precision"));
        assertNull(m.get("orientation_f1"));
        assertNull(m.get("directed_tpr"));
        assertNull(m.get("directed_fdr"));
        assertEquals(0.0, m.get("directed_fpr"));   // 0 errors over 3 non-edges: defined
        assertEquals(0.0, m.get("shd"));
        assertEquals(1.0, m.get("exact"));
        assertEquals(0.0, m.get("sid"));

        // an empty estimate of a non-empty truth: precision undefined, recall 0, F1 = 2·0/(0 + 1) = 0
        Graph one = Graph.builder(v).addDirected(0, 1).freeze();
        Map<String, Double> e = Scorer.scoreAll(Truth.of(one, GraphClass.DAG), empty, GraphClass.DAG);
        assertNull(e.get("adjacency_precision"));
        assertEquals(0.0, e.get("adjacency_recall"));
        assertEquals(0.0, e.get("adjacency_f1"));
        assertNull(e.get("directed_fdr"));

        // a truth joining every pair leaves no negatives: FPR undefined
        Graph full = Graph.builder(v).addDirected(0, 1).addDirected(1, 2).addDirected(0, 2).freeze();
        assertNull(Scorer.scoreAll(Truth.of(full, GraphClass.DAG), empty, GraphClass.DAG).get("directed_fpr"));
        assertNull(Scorer.scoreAll(Truth.of(full, GraphClass.DAG), empty, GraphClass.DAG).get("adjacency_fpr"));
        assertEquals(0.0, m.get("adjacency_fpr"));  // nothing added over 3 non-edges
    }
}

package dev.touchstone.learners.score;

import dev.touchstone.core.data.DataSet;
import dev.touchstone.core.graph.Edge;
import dev.touchstone.core.graph.Graph;
import dev.touchstone.core.knowledge.Knowledge;
import dev.touchstone.core.learner.Learner;
import dev.touchstone.core.learner.LearnerInput;
import org.junit.jupiter.api.DisplayName;
import org.junit.jupiter.api.Test;

import java.util.ArrayList;
import java.util.List;
import java.util.Map;
import java.util.zip.CRC32;

import static org.junit.jupiter.api.Assertions.assertEquals;

/**
 * The permutation searches return exactly the graphs they returned before their speed-ups, on
 * seeded finite-sample cases: the fingerprints below (edge count and a CRC-32 of the sorted edge
 * list) were recorded by running this test against the code before the one-walk order scores,
 * the forked subtrees and the allocation-free expansion of the grow-shrink trees, with the
 * starting orders drawn by the shared seeded shuffle ({@code core.random.Shuffles}; before it the
 * searches drew random starting orders with a loop of their own, giving other orders and so other
 * fingerprints). Speed-ups of the
 * trees must not change any answer (a tree query is a pure function of the tree's definition,
 * Andrews et al. 2023), so any difference here is a bug, not a tolerance question.
 */
class PermutationSearchRegressionTest {

    /** One seeded case: learner, data (p, mean degree, rows, seed), parameters, threads, and the recorded fingerprint. */
    record Case(Learner learner, int p, double degree, int rows, long seed, Map<String, Object> raw, int threads,
                String expected) {
        String label() {
            return learner.description().id() + " p=" + p + " degree=" + degree + " n=" + rows + " seed=" + seed + " "
                    + raw + " threads=" + threads;
        }
    }

    static String fingerprint(Graph g) {
        List<String> edges = new ArrayList<>();
        for (Edge e : g.edges()) {
            Edge c = e.canonical();
            edges.add(c.a() + "," + c.b() + "," + c.atA() + "," + c.atB());
        }
        edges.sort(null);
        CRC32 crc = new CRC32();
        crc.update(String.join(";", edges).getBytes(java.nio.charset.StandardCharsets.UTF_8));
        return g.edgeCount() + ":" + Long.toHexString(crc.getValue());
    }

    static List<Case> cases() {
        Learner boss = new BossLearner();
        Learner grasp = new GraspLearner();
        return List.of(
                new Case(boss, 30, 2, 1000, 1, Map.of(), 1, "31:43216342"),
                new Case(boss, 60, 4, 1000, 2, Map.of(), 2, "147:c4a7f742"),
                new Case(boss, 100, 4, 500, 3, Map.of(), 2, "238:b0fc7225"),
                new Case(boss, 100, 4, 500, 3, Map.of(), 1, "238:b0fc7225"),
                new Case(boss, 150, 3, 1000, 4, Map.of("score", "ebic"), 2, "247:2f2418fa"),
                new Case(boss, 80, 6, 300, 5, Map.of("starts", 3), 2, "290:b4c6e14d"),
                new Case(boss, 70, 4, 1000, 6, Map.of("backward_phase", false), 2, "162:5f03745c"),
                new Case(boss, 120, 2, 200, 7, Map.of("parent_limit", 3), 2, "233:94d42759"),
                new Case(grasp, 30, 3, 1000, 8, Map.of(), 1, "44:a19df2f3"),
                new Case(grasp, 50, 4, 500, 9, Map.of("starts", 2), 1, "112:c50dbd3e"));
    }

    @Test
    @DisplayName("BOSS and GRaSP return the graphs recorded from the code before the speed-ups on 10 seeded data cases")
    void sameGraphsAsBefore() {
        List<String> got = new ArrayList<>();
        List<String> want = new ArrayList<>();
        for (Case c : cases()) {
            DataSet data = ScoreData.linearGaussian(c.p(), c.degree(), c.rows(), c.seed());
            Graph g = BossLearnerTest.run(c.learner(), LearnerInput.of(data), Knowledge.none(), c.raw(), c.threads()).graph();
            got.add(c.label() + " -> " + fingerprint(g));
            want.add(c.label() + " -> " + c.expected());
        }
        assertEquals(String.join("\n", want), String.join("\n", got));
    }
}

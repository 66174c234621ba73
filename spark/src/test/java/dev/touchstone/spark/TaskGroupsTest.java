package dev.touchstone.spark;

import dev.touchstone.harness.execution.RunRecipe;
import dev.touchstone.harness.study.Plan;
import dev.touchstone.harness.study.RunDefinition;
import org.junit.jupiter.api.DisplayName;
import org.junit.jupiter.api.Test;

import java.util.ArrayList;
import java.util.HashMap;
import java.util.HashSet;
import java.util.List;
import java.util.Map;
import java.util.Set;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

/** Packing runs into tasks of whole replicates (common practice: one unit of shared input per task). */
class TaskGroupsTest {

    /** 2 settings × 4 replicates × 2 sample sizes × 3 configurations = 48 runs, 6 per replicate. */
    private static final String STUDY = "name: pack\nseed: 3\nreplicates: 4\n"
            + "truth:\n  graph: {family: erdos-renyi, nodes: [4, 6], mean_degree: 2}\n  model: {kind: linear-gaussian}\n"
            + "samples: [30, 90]\nlearners:\n  - {id: pc, use: pc, with: {alpha: [0.01, 0.05]}}\n  - {id: e, use: empty}\n"
            + "metrics: [shd]\n";

    private static final Plan PLAN = new RunRecipe(STUDY, null, null, null, null).rebuild().plan();

    @Test
    @DisplayName("every replicate lies in exactly one task, every run in exactly one, in the list's order")
    void wholeReplicates() {
        assertEquals(48, PLAN.runs().size());
        for (int max : new int[] {1, 5, 6, 7, 13, 1000}) {
            List<TaskGroup> tasks = TaskGroups.pack(PLAN.runs(), 90, max);
            Map<RunDefinition.ReplicateId, Integer> taskOf = new HashMap<>();
            List<Integer> order = new ArrayList<>();
            for (int t = 0; t < tasks.size(); t++) {
                TaskGroup g = tasks.get(t);
                assertTrue(g.size() <= Math.max(max, 6), "task " + t + " has " + g.size() + " runs, max " + max);
                assertEquals(90, g.rows());
                for (int i = 0; i < g.size(); i++) {
                    RunDefinition r = PLAN.runs().get(g.runs()[i]);
                    assertEquals(r.key(), g.keys()[i]);
                    Integer before = taskOf.put(r.replicateId(), t);
                    assertTrue(before == null || before == t, "replicate " + r.replicateId() + " split over tasks");
                    order.add(r.index());
                }
            }
            List<Integer> expected = new ArrayList<>();
            PLAN.runs().forEach(r -> expected.add(r.index()));
            assertEquals(expected, order, "max " + max);
            assertEquals(8, taskOf.size());
            int expectedTasks = max < 12 ? 8 : (int) Math.ceil(8.0 / (max / 6));
            assertEquals(expectedTasks, tasks.size(), "max " + max);
        }
    }

    @Test
    @DisplayName("a subset (a resume) keeps whole remaining replicates together; a non-positive size is refused")
    void subsetAndBadSize() {
        List<RunDefinition> rest = PLAN.runs().subList(10, 48);
        List<TaskGroup> tasks = TaskGroups.pack(rest, 90, 6);
        assertEquals(4 + 3, tasks.size(), "replicate 2 has 2 runs left, then 6 whole replicates");
        assertEquals(2, tasks.get(0).size());
        Set<Integer> all = new HashSet<>();
        tasks.forEach(t -> {
            for (int i : t.runs()) {
                assertTrue(all.add(i));
            }
        });
        assertEquals(38, all.size());
        assertThrows(IllegalArgumentException.class, () -> TaskGroups.pack(rest, 90, 0));
    }

    @Test
    @DisplayName("default task size: about four tasks per core, 1 to 1,000 runs")
    void defaultSize() {
        assertEquals(1250 > 1000 ? 1000 : 1250, TaskGroups.defaultMaxRuns(10_000, 2));
        assertEquals(1, TaskGroups.defaultMaxRuns(3, 8));
        assertEquals(3, TaskGroups.defaultMaxRuns(24, 2));
        assertEquals(1000, TaskGroups.defaultMaxRuns(1_000_000, 200));
        assertEquals(125, TaskGroups.defaultMaxRuns(100_000, 200));
    }
}

package dev.touchstone.harness.reproductions;

import dev.touchstone.metrics.results.RunResult;
import org.junit.jupiter.api.DisplayName;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

import java.nio.file.Path;
import java.util.List;

import static org.junit.jupiter.api.Assertions.assertTrue;

/**
 * Andrews, Ramsey, Sanchez-Romero, Camchong and Kummerfeld (2023, NeurIPS 36; qualitative, from
 * memory): on dense random graphs the permutation searches BOSS and GRaSP recover more of the true
 * adjacencies than GES and PC. Reduced grid: scenarios/reproductions/permutation-search-quick.yaml
 * (12 variables, mean degree 6, n = 1000, 20 replicates).
 */
class PermutationSearchTest {

    @TempDir
    Path out;

    @Test
    @DisplayName("dense graphs: BOSS and GRaSP have higher adjacency recall than PC (paired Wilcoxon), BOSS at least GES's mean (Andrews et al. 2023)")
    void permutationSearchesRecoverMoreAdjacencies() {
        BundledStudy s = BundledStudy.run("permutation-search-quick", out);
        List<RunResult> runs = s.runs;
        StringBuilder means = new StringBuilder();
        for (String c : List.of("boss", "grasp", "ges", "pc")) {
            means.append(c).append(' ').append(BundledStudy.mean(runs, c, "adjacency_recall")).append("; ");
        }
        for (String c : List.of("boss", "grasp", "ges", "pc")) {
            means.append(c).append(" precision ").append(BundledStudy.mean(runs, c, "adjacency_precision")).append("; ");
        }
        System.out.println("permutation-search-quick adjacency means: " + means);
        // Against PC the claim is asserted. Against GES it is not: on this grid BOSS's recall is higher
        // on 12 of 20 replicates (mean +0.010) but the signed-rank test gives p = 0.64, so the quick
        // grid does not show the paper's advantage over GES at the 5% level; only the sign is checked.
        for (String search : List.of("boss", "grasp")) {
            s.assertShift(runs, search, "pc", "adjacency_recall", +1);
        }
        assertTrue(BundledStudy.mean(runs, "boss", "adjacency_recall") >= BundledStudy.mean(runs, "ges", "adjacency_recall"),
                "mean adjacency recall, BOSS below GES: " + means);
    }
}

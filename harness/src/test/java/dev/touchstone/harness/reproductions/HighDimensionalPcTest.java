package dev.touchstone.harness.reproductions;

import dev.touchstone.metrics.results.RunResult;
import org.junit.jupiter.api.DisplayName;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

import java.nio.file.Path;
import java.util.List;

import static org.junit.jupiter.api.Assertions.assertTrue;

/**
 * Kalisch and Bühlmann (2007, JMLR 8, §4): on sparse random linear Gaussian DAGs PC's skeleton
 * gains true positives as n grows while its false positive rate stays low. Reduced grid:
 * scenarios/reproductions/high-dimensional-pc-quick.yaml.
 */
class HighDimensionalPcTest {

    @TempDir
    Path out;

    @Test
    @DisplayName("PC skeleton: TPR rises with n (paired Wilcoxon over replicates, n = 50 → 200 → 1000), FPR stays below α (Kalisch and Bühlmann 2007)")
    void tprRisesFprStaysLow() {
        BundledStudy s = BundledStudy.run("high-dimensional-pc-quick", out);
        List<RunResult> byN = BundledStudy.acrossAxis(s.runs, "pc", "samples");
        String n50 = BundledStudy.label("pc", "samples", "50");
        String n200 = BundledStudy.label("pc", "samples", "200");
        String n1000 = BundledStudy.label("pc", "samples", "1000");
        for (String larger : List.of(n200, n1000)) {
            s.assertShift(byN, larger, n50, "adjacency_recall", 1);
        }
        s.assertShift(byN, n1000, n200, "adjacency_recall", 1);
        for (String n : List.of("50", "200", "1000")) {
            double fpr = BundledStudy.mean(s.where("samples", n), "pc", "adjacency_fpr");
            // the paper's FPRs are of the order of α = 0.01 or far below; we ask no more than α
            assertTrue(fpr <= 0.01, "mean FPR at n = " + n + ": " + fpr);
        }
    }
}

package dev.touchstone.harness.reproductions;

import dev.touchstone.metrics.results.ComparisonRow;
import dev.touchstone.metrics.results.RunResult;
import org.junit.jupiter.api.DisplayName;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

import java.nio.file.Path;
import java.util.List;

import static org.junit.jupiter.api.Assertions.assertTrue;

/**
 * Tu et al. (2019, AISTATS), "Causal discovery in the presence of missing data": test-wise deletion
 * keeps more rows per test than list-wise deletion, so under MCAR PC finds more adjacencies at
 * similar precision; under MAR and MNAR deletion may add spurious edges. Reduced grid:
 * scenarios/reproductions/missing-data-quick.yaml (the three mechanisms on the same graphs and data).
 */
class MissingDataTest {

    @TempDir
    Path out;

    @Test
    @DisplayName("MCAR: test-wise deletion recovers more adjacencies than list-wise at similar precision (paired Wilcoxon; Tu et al. 2019)")
    void testWiseRecoversMoreUnderMcar() {
        BundledStudy s = BundledStudy.run("missing-data-quick", out);
        List<RunResult> mcar = s.where("missing", "mcar");
        s.assertShift(mcar, "test-wise", "list-wise", "adjacency_recall", 1);
        ComparisonRow precision = s.compare(mcar, "test-wise", "list-wise", "adjacency_precision");
        assertTrue(Math.abs(precision.meanDifference()) <= 0.05, "MCAR precision, test-wise − list-wise: " + precision);

        // Spurious edges under MAR / MNAR: test-wise deletion's skeleton FPR against its FPR under MCAR on the same
        // graphs and data. Not reproduced at this scale (see docs/reproductions.md): the rate rises slightly but not
        // significantly. What holds and is checked: the rise, if any, stays small (precision ≥ 0.9), and test-wise
        // deletion still finds more adjacencies than list-wise under both mechanisms.
        List<RunResult> byMechanism = BundledStudy.acrossAxis(s.runs, "test-wise", "missing");
        for (String mechanism : List.of("mar", "mnar")) {
            ComparisonRow fpr = s.compare(byMechanism, BundledStudy.label("test-wise", "missing", mechanism),
                    BundledStudy.label("test-wise", "missing", "mcar"), "adjacency_fpr");
            System.out.println("test-wise skeleton FPR, " + mechanism + " − mcar: " + fpr);
            List<RunResult> these = s.where("missing", mechanism);
            assertTrue(BundledStudy.mean(these, "test-wise", "adjacency_precision") >= 0.9, mechanism + " precision");
            s.assertShift(these, "test-wise", "list-wise", "adjacency_recall", 1);
        }

        // MVPC (permutation-corrected tests on top of test-wise deletion) must keep test-wise deletion's gain over
        // list-wise deletion where its assumptions hold (MCAR and MAR; the self-masking MNAR here violates them).
        for (String mechanism : List.of("mcar", "mar")) {
            List<RunResult> these = s.where("missing", mechanism);
            s.assertShift(these, "corrected", "list-wise", "adjacency_recall", 1);
            assertTrue(BundledStudy.mean(these, "corrected", "adjacency_precision") >= 0.9, mechanism + " MVPC precision");
        }
    }
}

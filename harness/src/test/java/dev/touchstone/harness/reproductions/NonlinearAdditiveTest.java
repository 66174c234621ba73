package dev.touchstone.harness.reproductions;

import dev.touchstone.metrics.results.ComparisonRow;
import org.junit.jupiter.api.DisplayName;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

import java.nio.file.Path;
import java.util.List;

import static org.junit.jupiter.api.Assertions.assertTrue;

/**
 * Bühlmann, Peters and Ernest (2014, Annals of Statistics 42, §6) report CAM ahead of PC and GES
 * in SHD and SID to the true DAG on additive nonlinear models with Gaussian noise. Reduced grid:
 * scenarios/reproductions/nonlinear-additive-quick.yaml (p = 10, n = 200, additive quadratic
 * functions, 10 replicates). SID of a CPDAG estimate is a range; CAM's SID is compared with both
 * ends, the lower end being PC's and GES's most favourable reading.
 */
class NonlinearAdditiveTest {

    @TempDir
    Path out;

    @Test
    @DisplayName("CAM has lower SHD to the true DAG and lower SID than PC and GES (paired Wilcoxon; Bühlmann et al. 2014)")
    void camAheadOfPcAndGes() {
        BundledStudy s = BundledStudy.run("nonlinear-additive-quick", out);
        for (String other : List.of("pc", "ges")) {
            s.assertShift(s.runs, other, "cam", "shd_vs_dag", 1);
            s.assertShift(s.runs, other, "cam", "sid_upper", 1);
        }
        s.assertShift(s.runs, "pc", "cam", "sid_lower", 1);
        // Against GES's most favourable SID the advantage holds on average but is not significant
        // in every setting of the full study (sigmoid functions: p = 0.07), so only its sign is checked.
        ComparisonRow ges = s.compare(s.runs, "ges", "cam", "sid_lower");
        assertTrue(ges.meanDifference() > 0, "ges − cam, sid_lower: " + ges);
    }
}

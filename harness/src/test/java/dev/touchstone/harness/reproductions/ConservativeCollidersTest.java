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
 * Ramsey, Zhang and Spirtes (2006, UAI): conservative collider orientation makes fewer arrowhead
 * errors than PC's sepset rule at small samples, leaving more edges unoriented. Reduced grid:
 * scenarios/reproductions/conservative-colliders-quick.yaml.
 */
class ConservativeCollidersTest {

    @TempDir
    Path out;

    @Test
    @DisplayName("n = 100: conservative PC has fewer wrong arrowheads and more undirected edges than PC (paired Wilcoxon; Ramsey, Zhang and Spirtes 2006)")
    void fewerWrongArrowheadsMoreUndirected() {
        BundledStudy s = BundledStudy.run("conservative-colliders-quick", out);
        List<RunResult> small = s.where("samples", "100");
        s.assertShift(small, "conservative", "pc", "wrong_arrowheads", -1);
        s.assertShift(small, "conservative", "pc", "undirected_edges", 1);
        // the rule only withholds arrowheads: the skeleton and so the SHD's adjacency part are the same
        ComparisonRow precision = s.compare(small, "conservative", "pc", "orientation_precision");
        assertTrue(precision.meanDifference() > 0, "orientation precision, conservative − pc: " + precision);
    }
}

package dev.touchstone.harness.cli;

import org.junit.jupiter.api.DisplayName;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

import java.io.IOException;
import java.io.PrintWriter;
import java.io.StringWriter;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

/**
 * A valid study whose paired comparison has almost only zero differences: PC and GES agree on
 * the sprinkler network's adjacencies in 14 of 15 replicates. It once ended with exit 1 (the
 * signed-rank p-value was NaN); now it runs, compares and reports.
 */
class TiedComparisonStudyTest {

    @TempDir
    Path tmp;

    @Test
    @DisplayName("sprinkler, 15 replicates, n = 400, PC and GES on adjacency_f1 compared to GES: exit 0, a p-value in [0, 1] (Pratt 1959 ranks, exact), a report")
    void mostlyZeroDifferences() throws IOException {
        Path study = tmp.resolve("tied.yaml");
        Files.writeString(study, String.join("\n",
                "name: tied",
                "seed: 2",
                "replicates: 15",
                "truth:",
                "  - network: sprinkler",
                "samples: [400]",
                "learners:",
                "  - {id: pc, use: pc, with: {alpha: 0.05}}",
                "  - {id: ges, use: ges}",
                "metrics: [adjacency_f1]",
                "compare_to: ges", ""));
        Path out = tmp.resolve("out");
        StringWriter err = new StringWriter();
        int status = Main.execute(new String[] {"run", study.toString(), "--out", out.toString(), "--quiet", "--threads", "2"},
                new PrintWriter(new StringWriter(), true), new PrintWriter(err, true));
        assertEquals(0, status, err.toString());
        List<String> rows = Files.readAllLines(out.resolve("comparisons.csv"));
        assertEquals(2, rows.size(), String.join("\n", rows));
        List<String> header = List.of(rows.get(0).split(",", -1));
        String[] row = rows.get(1).split(",", -1);
        int ties = Integer.parseInt(row[header.indexOf("n_ties")]);
        assertTrue(ties >= 13, "the case needs mostly zero differences: " + rows.get(1));
        assertTrue(ties < 15, "the case needs at least one nonzero difference: " + rows.get(1));
        double p = Double.parseDouble(row[header.indexOf("p_value")]);
        assertTrue(p >= 0 && p <= 1, rows.get(1));
        assertTrue(Files.exists(out.resolve("report.html")));
    }
}

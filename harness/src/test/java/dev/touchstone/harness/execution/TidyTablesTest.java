package dev.touchstone.harness.execution;

import com.fasterxml.jackson.databind.ObjectMapper;
import dev.touchstone.harness.study.Plan;
import dev.touchstone.harness.testing.TestWorld;
import org.apache.commons.csv.CSVFormat;
import org.apache.commons.csv.CSVParser;
import org.apache.commons.csv.CSVRecord;
import org.junit.jupiter.api.BeforeAll;
import org.junit.jupiter.api.DisplayName;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

import java.io.IOException;
import java.io.PrintWriter;
import java.io.StringWriter;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.HashMap;
import java.util.HashSet;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.Set;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;
import static org.junit.jupiter.api.Assertions.fail;

/**
 * Reads every CSV table of a small study with Commons CSV, as R or pandas would, and checks
 * each column holds one type: integers parse as long, reals as double, booleans are
 * {@code true}/{@code false}, and an empty cell only where a value can be undefined. The
 * expected type of each fixed column is written here by hand; the {@code truth.*} and
 * {@code learner.*} columns, whose names come from the study, must each be of one type.
 */
class TidyTablesTest {

    enum Kind { INTEGER, REAL, BOOLEAN, TEXT }

    /** Expected kind of each fixed column, and the columns whose cells may be empty (undefined or not measured). */
    static final Map<String, Kind> KINDS = new HashMap<>();
    static final Set<String> MAY_BE_EMPTY = new HashSet<>();

    static {
        for (String c : List.of("run", "truth_setting", "replicate", "seed", "seed_high", "seed_low", "n_ok",
                "n_failed", "n_skipped", "n_values", "n_pairs")) {
            KINDS.put(c, Kind.INTEGER);
        }
        for (String c : List.of("samples", "n_tests", "n_scores", "n_wins", "n_ties", "n_losses")) {
            KINDS.put(c, Kind.INTEGER);
            MAY_BE_EMPTY.add(c);
        }
        for (String c : List.of("shd", "edges", "seconds", "cpu_seconds", "allocated_mb", "mean",
                "sd", "ci95_low", "ci95_high", "median", "q1", "q3", "mean_difference", "p_value", "p_holm")) {
            KINDS.put(c, Kind.REAL);
            MAY_BE_EMPTY.add(c);
        }
        KINDS.put("oracle", Kind.BOOLEAN);
        for (String c : List.of("key", "configuration", "learner", "status", "metric", "reference")) {
            KINDS.put(c, Kind.TEXT);
        }
        for (String c : List.of("message", "estimate_class", "scored_against")) {
            KINDS.put(c, Kind.TEXT);
            MAY_BE_EMPTY.add(c);
        }
    }

    @TempDir
    static Path tmp;
    static Path out;

    @BeforeAll
    static void runStudy() {
        Plan plan = TestWorld.plan(StudyRunnerTest.STUDY);
        out = tmp.resolve("study");
        // The real aggregator (bootstrap intervals, Wilcoxon, Holm), so summary.csv and comparisons.csv have every cell.
        new StudyRunner(TestWorld.SIMULATOR, TestWorld.SCORER, new MetricsAggregator()).run(plan, new StudyRunner.Options(out, 2, Progress.quiet(),
                new PrintWriter(new StringWriter())));
    }

    static List<CSVRecord> read(Path csv, List<String> header) throws IOException {
        try (CSVParser p = CSVParser.parse(csv, StandardCharsets.UTF_8,
                CSVFormat.DEFAULT.builder().setHeader().setSkipHeaderRecord(true).get())) {
            header.addAll(p.getHeaderNames());
            return p.getRecords();
        }
    }

    static boolean is(Kind kind, String cell) {
        try {
            switch (kind) {
                case INTEGER:
                    Long.parseLong(cell);
                    return true;
                case REAL:
                    return Double.isFinite(Double.parseDouble(cell));
                case BOOLEAN:
                    return cell.equals("true") || cell.equals("false");
                default:
                    return true;
            }
        } catch (NumberFormatException e) {
            return false;
        }
    }

    /** The narrowest kind every non-empty cell of a column has. */
    static Kind inferred(List<String> cells) {
        for (Kind k : List.of(Kind.BOOLEAN, Kind.INTEGER, Kind.REAL)) {
            if (cells.stream().filter(c -> !c.isEmpty()).allMatch(c -> is(k, c))) {
                return k;
            }
        }
        return Kind.TEXT;
    }

    static void checkTypes(Path csv, Map<String, Kind> prefixed) throws IOException {
        List<String> header = new ArrayList<>();
        List<CSVRecord> rows = read(csv, header);
        assertFalse(rows.isEmpty(), csv + " has rows");
        for (String column : header) {
            List<String> cells = new ArrayList<>();
            for (CSVRecord r : rows) {
                assertTrue(r.isConsistent(), csv + ": a row with a different number of cells: " + r);
                cells.add(r.get(column));
            }
            Kind expected = KINDS.get(column);
            if (expected == null) {
                expected = prefixed.get(column);
            }
            if (expected == null) {
                fail(csv.getFileName() + ": column " + column + " has no expected type (inferred "
                        + inferred(cells) + ")");
            }
            for (int i = 0; i < cells.size(); i++) {
                String cell = cells.get(i);
                if (cell.isEmpty()) {
                    assertTrue(MAY_BE_EMPTY.contains(column) || column.startsWith("truth.")
                            || column.startsWith(ResultTables.LEARNER_PREFIX),
                            csv.getFileName() + " row " + (i + 1) + ": " + column + " is empty");
                } else {
                    assertTrue(is(expected, cell), csv.getFileName() + " row " + (i + 1) + ": " + column + " = "
                            + cell + " is not " + expected);
                }
            }
        }
    }

    @Test
    @DisplayName("runs.csv, summary.csv and comparisons.csv: every column of one type, parsed with Commons CSV")
    void everyColumnHasOneType() throws IOException {
        // The truth and learner columns, by hand from StudyRunnerTest.STUDY (with the default hidden and missing
        // sections, and the test learners' parameters).
        Map<String, Kind> prefixed = new LinkedHashMap<>();
        prefixed.put("truth.graph", Kind.TEXT);
        prefixed.put("truth.model", Kind.TEXT);
        prefixed.put("truth.hidden", Kind.TEXT);
        prefixed.put("truth.missing", Kind.TEXT);
        prefixed.put("truth.nodes", Kind.INTEGER);
        prefixed.put("learner.alpha", Kind.REAL);
        prefixed.put("learner.threshold", Kind.REAL);
        for (String f : List.of("runs.csv", "summary.csv", "comparisons.csv")) {
            checkTypes(out.resolve(f), prefixed);
        }
    }

    @Test
    @DisplayName("runs.csv: samples numeric with a separate oracle flag, truth_setting joins runs of one truth, seed halves rebuild the seed")
    void runsColumns() throws IOException {
        List<String> header = new ArrayList<>();
        List<CSVRecord> rows = read(out.resolve("runs.csv"), header);
        assertFalse(header.contains("parameters"), "no packed parameter column: " + header);
        assertTrue(header.contains("learner.alpha") && header.contains("truth.nodes"), header.toString());
        Set<String> samples = new HashSet<>();
        Map<String, String> truthByIndex = new HashMap<>();
        for (CSVRecord r : rows) {
            boolean oracle = Boolean.parseBoolean(r.get("oracle"));
            samples.add(oracle ? "oracle" : r.get("samples"));
            assertEquals(oracle, r.get("samples").isEmpty(), r.toString());
            // one truth setting = one graph family and node count, whatever the sample size
            String truth = r.get("truth.graph") + "/" + r.get("truth.nodes");
            String before = truthByIndex.putIfAbsent(r.get("truth_setting"), truth);
            assertTrue(before == null || before.equals(truth), "truth_setting " + r.get("truth_setting")
                    + " names two truths: " + before + " and " + truth);
            assertEquals(Long.parseLong(r.get("seed")),
                    SeedCells.join(Long.parseLong(r.get("seed_high")), Long.parseLong(r.get("seed_low"))), r.toString());
            if (r.get("configuration").startsWith("empty")) {
                assertTrue(Set.of("0.01", "0.05").contains(r.get("learner.alpha")), r.toString());
            } else {
                assertEquals("", r.get("learner.alpha"), "skel has no alpha: " + r);
            }
        }
        assertEquals(Set.of("30", "200", "oracle"), samples);
        assertEquals(4, truthByIndex.size(), "2 families x 2 node counts: " + truthByIndex);
        assertEquals(4, new HashSet<>(truthByIndex.values()).size());
    }

    @Test
    @DisplayName("provenance.json names the tables' schema version")
    void schemaVersion() throws IOException {
        var json = new ObjectMapper().readTree(out.resolve("provenance.json").toFile());
        assertEquals(ResultTables.SCHEMA, json.get("tables_schema").asInt());
        assertEquals(2, ResultTables.SCHEMA);
    }

    @Test
    @DisplayName("seed halves: each exact in a double, and high * 2^32 + low is the seed (checked with BigInteger)")
    void seedHalves() {
        java.math.BigInteger twoTo32 = java.math.BigInteger.ONE.shiftLeft(32);
        for (long seed : new long[] {0L, 1L, -1L, -42L, (1L << 53) + 1, Long.MAX_VALUE, Long.MIN_VALUE,
                0x9E37_79B9_7F4A_7C15L}) {
            long high = SeedCells.high(seed);
            long low = SeedCells.low(seed);
            assertTrue(Math.abs(high) <= (1L << 53) && low >= 0 && low < (1L << 32), seed + ": " + high + ", " + low);
            assertEquals((double) high, Double.parseDouble(Long.toString(high)));
            assertEquals(java.math.BigInteger.valueOf(seed),
                    java.math.BigInteger.valueOf(high).multiply(twoTo32).add(java.math.BigInteger.valueOf(low)));
            assertEquals(seed, SeedCells.join(high, low));
        }
    }
}

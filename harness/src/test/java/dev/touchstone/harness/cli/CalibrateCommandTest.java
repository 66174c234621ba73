package dev.touchstone.harness.cli;

import dev.touchstone.core.data.DataSet;
import dev.touchstone.generators.networks.ReferenceNetwork;
import dev.touchstone.generators.networks.ReferenceNetworks;
import dev.touchstone.harness.io.DataCsv;
import dev.touchstone.harness.io.GraphJson;
import dev.touchstone.reports.Cautions;
import org.junit.jupiter.api.DisplayName;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

/** {@code touchstone calibrate} end to end, on small replicate counts so it runs in seconds. */
class CalibrateCommandTest {

    @TempDir
    Path tmp;

    /**
     * The chest-clinic network's data (Lauritzen and Spiegelhalter 1988; published tables, from
     * memory): no open data set with suitable variables ships with a Maven or Debian
     * package we use, so the fallback applies.
     */
    @Test
    @DisplayName("chest clinic: calibrate with the published graph writes the report with cautions first, edges"
            + " and the answer about more rows")
    void chestClinicEndToEnd() throws IOException {
        ReferenceNetwork asia = ReferenceNetworks.chestClinic();
        Path data = tmp.resolve("asia.csv");
        DataCsv.write(data, asia.model().sample(1000, 7));
        Path graph = tmp.resolve("asia.json");
        GraphJson.write(graph, asia.dag());
        Path out = tmp.resolve("out");
        CliTest.Result r = CliTest.cli("calibrate", "--data", data.toString(), "--graph", graph.toString(),
                "--learner", "pc,ges", "--replicates", "6", "--variants", "1", "--bootstrap", "4", "--threads", "2",
                "--out", out.toString(), "--seed", "3");
        assertEquals(0, r.status(), r.err());
        assertTrue(r.err().contains("asia: discrete"), r.err());
        assertTrue(r.out().contains("pc at 1,000 rows (your size): orientation_precision median "), r.out());
        for (String line : r.out().lines().filter(l -> l.contains(" median ")).toList()) {
            assertMedianInsideItsRange(line);
        }
        assertTrue(r.out().contains("ges: "), r.out());
        String html = Files.readString(out.resolve("calibration.html"));
        String md = Files.readString(out.resolve("calibration.md"));
        int caution = html.indexOf(Cautions.LINES.get(0));
        assertTrue(caution > 0 && caution < html.indexOf("<h2 id=\"data\">"), "cautions come first");
        assertTrue(md.indexOf(Cautions.HEADING) < md.indexOf("## Your data"));
        assertTrue(html.contains("<svg") && !html.contains("<script") && !html.contains("url(http")
                && !html.contains("href=\"http") && !html.contains("src=\"http"), "self-contained");
        assertTrue(md.contains("| pc | either → xray | yes |"), md);
        assertTrue(md.contains("## With more (or fewer) rows"));
        assertTrue(md.contains("Made by touchstone "), "provenance: the tool's version and commit");
        List<String> runs = Files.readAllLines(out.resolve("calibration-runs.csv"));
        // 6 replicates × 4 sizes × 2 learners + 4 resamples × 2 learners, plus the header.
        assertEquals(1 + 6 * 4 * 2 + 4 * 2, runs.size());
        assertTrue(runs.get(0).startsWith("truth,replicate,rows,learner,status,message,adjacency_precision"));
    }

    /**
     * "median M, 10%–90% of replicates A – B": the 10th percentile, median and 90th percentile of
     * one sample are ordered by definition of quantiles, so the printed range contains its value.
     */
    private static void assertMedianInsideItsRange(String line) {
        java.util.regex.Matcher m = java.util.regex.Pattern.compile(
                "median (\\S+), 10%–90% of replicates (\\S+) – (\\S+), mean (\\S+)").matcher(line);
        assertTrue(m.find(), line);
        double median = Double.parseDouble(m.group(1));
        assertTrue(Double.parseDouble(m.group(2)) <= median && median <= Double.parseDouble(m.group(3)), line);
    }

    @Test
    @DisplayName("a learner that does not take the data's kind is refused before anything runs, in one line")
    void learnerOfAnotherKindRefused() throws IOException {
        Path data = tmp.resolve("asia.csv");
        DataCsv.write(data, ReferenceNetworks.chestClinic().model().sample(1000, 7));
        Path out = tmp.resolve("refused");
        CliTest.Result r = CliTest.cli("calibrate", "--data", data.toString(), "--learner", "pc,direct-lingam",
                "--replicates", "2", "--out", out.toString());
        assertEquals(2, r.status(), r.err());
        String last = r.err().strip().lines().reduce((a, b) -> b).orElse("");
        assertEquals("error: --learner: direct-lingam does not accept discrete data (it takes continuous); leave it"
                + " out or declare the column kinds with --kinds", last, r.err());
        assertTrue(!Files.exists(out), "nothing written");
    }

    @Test
    @DisplayName("mixed data with missing cells and a learned truth graph: kinds overridden, MCAR stated,"
            + " heavy missingness warned")
    void mixedWithMissing() throws IOException {
        DataSet asia = ReferenceNetworks.chestClinic().model().sample(400, 2);
        StringBuilder csv = new StringBuilder("smoke,lung,bronc,dysp,age\n");
        org.apache.commons.rng.UniformRandomProvider rng = dev.touchstone.core.random.Seeds.random(4);
        for (int i = 0; i < 400; i++) {
            int smoke = asia.discrete(asia.indexOf("smoke"))[i];
            double age = 40 + 10 * smoke + 5 * rng.nextDouble();
            String dysp = rng.nextDouble() < 0.3 ? "" : Integer.toString(asia.discrete(asia.indexOf("dysp"))[i]);
            csv.append(smoke).append(',').append(asia.discrete(asia.indexOf("lung"))[i]).append(',')
                    .append(asia.discrete(asia.indexOf("bronc"))[i]).append(',').append(dysp).append(',')
                    .append(String.format(java.util.Locale.ROOT, "%.3f", age)).append('\n');
        }
        Path data = tmp.resolve("mixed.csv");
        Files.writeString(data, csv.toString());
        Path out = tmp.resolve("out");
        CliTest.Result r = CliTest.cli("calibrate", "--data", data.toString(), "--discrete", "smoke,lung,bronc,dysp",
                "--learner", "pc", "--set", "pc.alpha=0.05", "--replicates", "4", "--variants", "1", "--bootstrap", "3", "--threads", "2",
                "--samples", "200,400", "--out", out.toString());
        assertEquals(0, r.status(), r.err());
        assertTrue(r.err().contains("smoke: discrete (declared)"), r.err());
        assertTrue(r.out().contains("warning: dysp is missing in"), r.out());
        String md = Files.readString(out.resolve("calibration.md"));
        assertTrue(md.contains("completely at random (MCAR)"), md);
        assertTrue(md.contains("learned from the data by ges"), md);
    }

    @Test
    @DisplayName("bad data and bad options: exit 2 with one line 'error: …' naming the file or option")
    void badInput() throws IOException {
        Path ragged = tmp.resolve("ragged.csv");
        Files.writeString(ragged, "a,b\n1,2\n3\n");
        CliTest.Result r = CliTest.cli("calibrate", "--data", ragged.toString());
        assertEquals(2, r.status());
        assertTrue(r.err().startsWith("error: ") && r.err().contains("ragged.csv"), r.err());
        assertEquals(1, r.err().strip().lines().count(), r.err());
        Path ok = tmp.resolve("ok.csv");
        Files.writeString(ok, "a,b\n1,2\n3,5\n2,2\n4,1\n5,3\n");
        r = CliTest.cli("calibrate", "--data", ok.toString(), "--learner", "no-such-learner");
        assertEquals(2, r.status());
        assertTrue(r.err().contains("--learner: unknown learner 'no-such-learner'"), r.err());
        r = CliTest.cli("calibrate", "--data", ok.toString(), "--learner", "pc", "--set", "pc.alpha=7");
        assertEquals(2, r.status());
        assertTrue(r.err().startsWith("error: --set: ") && r.err().contains("alpha"), r.err());
        // as for learn and simulate (Settings), a parameter set twice is refused rather than the last one winning
        r = CliTest.cli("calibrate", "--data", ok.toString(), "--learner", "pc", "--set", "pc.alpha=0.01",
                "--set", "pc.alpha=0.05");
        assertEquals(2, r.status());
        assertTrue(r.err().startsWith("error: --set pc.alpha=0.05: ") && r.err().contains("set twice"), r.err());
        r = CliTest.cli("calibrate", "--data", ok.toString(), "--learner", "pc", "--set", "alpha=0.01");
        assertEquals(2, r.status());
        assertTrue(r.err().startsWith("error: --set alpha=0.01: expected ID.NAME=VALUE"), r.err());
        // a size or learner given twice made duplicate runs (same keys), reported as runs that did not finish
        r = CliTest.cli("calibrate", "--data", ok.toString(), "--samples", "4,8,4");
        assertEquals(2, r.status());
        assertEquals("error: --samples: 4 is listed twice", r.err().strip());
        r = CliTest.cli("calibrate", "--data", ok.toString(), "--learner", "pc,ges,pc");
        assertEquals(2, r.status());
        assertEquals("error: --learner: pc is listed twice", r.err().strip());
                r = CliTest.cli("calibrate", "--data", ok.toString(), "--truth-learner", "fci");
        assertEquals(2, r.status());
        assertTrue(r.err().contains("error: --truth-learner fci: it returns a pag"), r.err());
                r = CliTest.cli("calibrate", "--data", ok.toString(), "--replicates", "0");
        assertEquals(2, r.status());
        assertEquals("error: --replicates: 0 is less than 1", r.err().strip());
                Path graph = tmp.resolve("g.json");
        GraphJson.write(graph, dev.touchstone.core.graph.Graph.empty(List.of("a", "c")));
        r = CliTest.cli("calibrate", "--data", ok.toString(), "--graph", graph.toString());
        assertEquals(2, r.status());
        assertTrue(r.err().contains("g.json") && r.err().contains("not the data's columns"), r.err());
    }
}

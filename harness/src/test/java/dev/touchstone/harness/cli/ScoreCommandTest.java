package dev.touchstone.harness.cli;

import org.junit.jupiter.api.DisplayName;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

import java.io.IOException;
import java.io.PrintWriter;
import java.io.StringWriter;
import java.nio.file.Files;
import java.nio.file.Path;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

class ScoreCommandTest {

    @TempDir
    Path dir;

    /** Pearl's sprinkler network (Pearl, Causality, 2000, ch. 1). */
    private static final String SPRINKLER = "{\"variables\": [\"season\", \"sprinkler\", \"rain\", \"wet\", \"slippery\"],"
            + " \"edges\": ["
            + "{\"between\": [\"season\", \"sprinkler\"], \"marks\": [\"tail\", \"arrow\"]},"
            + "{\"between\": [\"season\", \"rain\"], \"marks\": [\"tail\", \"arrow\"]},"
            + "{\"between\": [\"sprinkler\", \"wet\"], \"marks\": [\"tail\", \"arrow\"]},"
            + "{\"between\": [\"rain\", \"wet\"], \"marks\": [\"tail\", \"arrow\"]},"
            + "{\"between\": [\"wet\", \"slippery\"], \"marks\": [\"tail\", \"arrow\"]}]}";

    private String[] run(String... args) {
        StringWriter out = new StringWriter();
        StringWriter err = new StringWriter();
        int status = Main.execute(args, new PrintWriter(out), new PrintWriter(err));
        return new String[] {Integer.toString(status), out.toString(), err.toString()};
    }

    private Path file(String name, String text) throws IOException {
        Path f = dir.resolve(name);
        Files.writeString(f, text);
        return f;
    }

    private static String metric(String output, String name) {
        for (String line : output.split("\n")) {
            String[] parts = line.trim().split("\\s+");
            if (parts.length == 2 && parts[0].equals(name)) {
                return parts[1];
            }
        }
        throw new AssertionError("no line for " + name + " in\n" + output);
    }

    @Test
    @DisplayName("the sprinkler CPDAG (season—sprinkler, season—rain, sprinkler→wet←rain, wet→slippery; Pearl 2000) scores SHD 0 against the sprinkler DAG")
    void trueCpdagScoresPerfectly() throws IOException {
        Path truth = file("truth.json", SPRINKLER);
        Path estimate = file("est.csv", "node_a,node_b,mark_a,mark_b\n"
                + "season,sprinkler,tail,tail\nseason,rain,tail,tail\nsprinkler,wet,tail,arrow\n"
                + "rain,wet,tail,arrow\nwet,slippery,tail,arrow\n");
        String[] r = run("score", "--truth", truth.toString(), "--estimate", estimate.toString());
        assertEquals("0", r[0], r[2]);
        assertTrue(r[1].startsWith("estimate as cpdag, scored against the true cpdag"), r[1]);
        assertEquals("0", metric(r[1], "shd"));
        assertEquals("1", metric(r[1], "adjacency_f1"));
    }

    @Test
    @DisplayName("the sprinkler DAG with wet→slippery reversed: one pair differs, so SHD 1 (Tsamardinos et al. 2006)")
    void reversedEdgeCountsOnce() throws IOException {
        Path truth = file("truth.json", SPRINKLER);
        Path estimate = file("est.json", SPRINKLER.replace(
                "{\"between\": [\"wet\", \"slippery\"], \"marks\": [\"tail\", \"arrow\"]}",
                "{\"between\": [\"wet\", \"slippery\"], \"marks\": [\"arrow\", \"tail\"]}"));
        String[] r = run("score", "--truth", truth.toString(), "--estimate", estimate.toString(), "--as", "dag", "--json");
        assertEquals("0", r[0], r[2]);
        assertTrue(r[1].contains("\"estimate_class\" : \"dag\""), r[1]);
        assertTrue(r[1].contains("\"shd\" : 1.0"), r[1]);
        assertTrue(r[1].contains("\"adjacency_precision\" : 1.0"), r[1]);
    }

    @Test
    void badInputExitsTwoWithOneLine() throws IOException {
        Path truth = file("truth.json", SPRINKLER);
        Path estimate = file("est.json", "{\"variables\": [\"season\"], \"edges\": []}");
        String[] r = run("score", "--truth", truth.toString(), "--estimate", estimate.toString());
        assertEquals("2", r[0]);
        assertTrue(r[2].startsWith("error: ") && r[2].contains("different variables"), r[2]);
        String[] badClass = run("score", "--truth", truth.toString(), "--estimate", truth.toString(), "--as", "tree");
        assertEquals("2", badClass[0]);
        assertTrue(badClass[2].contains("--as: unknown class 'tree' (allowed: dag, cpdag, pag)"), badClass[2]);
        Path broken = file("broken.json", "{\"variables\": [\"a\"], \"edges\": [{\"between\": [\"a\", \"b\"], \"marks\": [\"tail\", \"arrow\"]}]}");
        String[] e = run("score", "--truth", broken.toString(), "--estimate", truth.toString());
        assertEquals("2", e[0]);
        assertTrue(e[2].contains("broken.json, edge 1 (a, b): unknown variable 'b'"), e[2]);
    }

    @Test
    @DisplayName("a hidden common cause: A <- H -> B with H hidden has the MAG A <-> B and the PAG A o-o B"
            + " (Richardson and Spirtes 2002; Zhang 2008), so the estimate A o-o B scores SHD 0")
    void pagEstimateAgainstADagWithAHiddenConfounder() throws IOException {
        Path truth = file("hidden.json", "{\"variables\": [\"A\", \"B\", \"H\"], \"hidden\": [\"H\"], \"edges\": ["
                + "{\"between\": [\"H\", \"A\"], \"marks\": [\"tail\", \"arrow\"]},"
                + "{\"between\": [\"H\", \"B\"], \"marks\": [\"tail\", \"arrow\"]}]}");
        Path estimate = file("pag.json", "{\"variables\": [\"A\", \"B\"], \"edges\": ["
                + "{\"between\": [\"A\", \"B\"], \"marks\": [\"circle\", \"circle\"]}]}");
        String[] r = run("score", "--truth", truth.toString(), "--estimate", estimate.toString(), "--as", "pag");
        assertEquals("0", r[0], r[2]);
        assertTrue(r[1].startsWith("estimate as pag, scored against the true pag"), r[1]);
        assertEquals("0", metric(r[1], "shd"));
    }
}

package dev.touchstone.harness.cli;

import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;

import static dev.touchstone.harness.cli.CliTest.cli;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertNotEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

/** Column kinds: simulate's sidecar, --discrete/--continuous and --kinds for learn, and the note when none is declared. */
class ColumnKindsCliTest {

    @TempDir
    Path tmp;

    @Test
    void discreteDataWithDeclaredKindsGetsTheGSquareTest() throws IOException {
        Path sim = tmp.resolve("sim");
        CliTest.Result s = cli("simulate", "--model", "discrete", "--set", "nodes=5", "--set", "categories_low=2",
                "--set", "categories_high=3", "--samples", "500", "--out", sim.toString());
        assertEquals(0, s.status(), s.err());
        Path data = sim.resolve("data.csv");
        Path kinds = sim.resolve("data.kinds.csv");
        assertTrue(Files.readString(kinds).startsWith("column,kind\n"), "simulate writes the kinds beside the data");
        assertTrue(Files.readString(kinds).contains(",discrete\n"));

        // The sidecar is read by itself: g-square (which needs discrete data) is accepted, and auto picks it.
        Path explicit = tmp.resolve("g2.json");
        CliTest.Result g2 = cli("learn", "--learner", "pc", "--set", "test=g-square", "--data", data.toString(),
                "--out", explicit.toString());
        assertEquals(0, g2.status(), g2.err());
        assertFalse(g2.err().contains("kinds:"), "every column declared, nothing assumed: " + g2.err());
        Path auto = tmp.resolve("auto.json");
        assertEquals(0, cli("learn", "--learner", "pc", "--data", data.toString(), "--out", auto.toString()).status());
        assertEquals(Files.readString(explicit), Files.readString(auto), "auto uses G² on declared discrete data");

        // The same file without its sidecar: codes are read as continuous, and the tool says so in one line.
        Path bare = tmp.resolve("bare.csv");
        Files.copy(data, bare);
        CliTest.Result refused = cli("learn", "--learner", "pc", "--set", "test=g-square", "--data", bare.toString());
        assertNotEquals(0, refused.status());
        assertEquals(1, refused.err().strip().lines().count(), "one error line: " + refused.err());
        String line = refused.err().strip();
        assertTrue(line.startsWith("error: "), line);
        assertTrue(line.contains("needs discrete data"), line);
        assertTrue(line.contains("(kinds: none declared; assumed 5 continuous"), line);
        assertTrue(line.contains("read as continuous though every value is a whole number: X"), line);
        CliTest.Result assumedOk = cli("learn", "--learner", "pc", "--data", bare.toString());
        assertEquals(0, assumedOk.status(), assumedOk.err());
        assertTrue(assumedOk.err().startsWith("kinds: none declared; assumed 5 continuous"), assumedOk.err());

        // Declared on the command line, or in a kinds file of one's own.
        CliTest.Result listed = cli("learn", "--learner", "pc", "--set", "test=g-square", "--data", bare.toString(),
                "--discrete", "X1,X2,X3", "--discrete", "X4,X5");
        assertEquals(0, listed.status(), listed.err());
        Path mine = tmp.resolve("mine.csv");
        Files.copy(kinds, mine);
        CliTest.Result fromFile = cli("learn", "--learner", "pc", "--set", "test=g-square", "--data", bare.toString(),
                "--kinds", mine.toString(), "--out", tmp.resolve("f.json").toString());
        assertEquals(0, fromFile.status(), fromFile.err());
        assertEquals(Files.readString(explicit), Files.readString(tmp.resolve("f.json")));
    }

    @Test
    void badKindsFilesAreOneLineErrors() throws IOException {
        Path data = tmp.resolve("d.csv");
        Files.writeString(data, "a,b\n1,2\n2,3.5\n3,1\n");
        Path k = tmp.resolve("k.csv");
        Files.writeString(k, "column,kind\na,ordinal\n");
        CliTest.Result r = cli("learn", "--learner", "pc", "--data", data.toString(), "--kinds", k.toString());
        assertEquals(2, r.status());
        assertTrue(r.err().startsWith("error: " + k + ", line 2: unknown kind 'ordinal' (allowed: continuous,"
                + " discrete)"), r.err());
        Files.writeString(k, "column,kind\nz,discrete\n");
        CliTest.Result unknown = cli("learn", "--learner", "pc", "--data", data.toString(), "--kinds", k.toString());
        assertEquals(2, unknown.status());
        assertTrue(unknown.err().contains("column 'z' is declared discrete but the header has no such column"),
                unknown.err());
        CliTest.Result both = cli("learn", "--learner", "pc", "--data", data.toString(), "--discrete", "a",
                "--continuous", "a");
        assertEquals(2, both.status());
        assertTrue(both.err().contains("column 'a' is given both --discrete and --continuous"), both.err());
    }
}

package dev.touchstone.harness.cli;

import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;

import static dev.touchstone.harness.cli.CliTest.cli;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertNotEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

/** {@code simulate} writes model.json; {@code simulate --model model.json} draws the same data again. */
class SimulateModelFileTest {

    @TempDir
    Path tmp;

    private void sameDataAgain(String... truthOptions) throws IOException {
        Path first = tmp.resolve("first");
        String[] args = new String[truthOptions.length + 6];
        System.arraycopy(truthOptions, 0, args, 1, truthOptions.length);
        args[0] = "simulate";
        args[truthOptions.length + 1] = "--samples";
        args[truthOptions.length + 2] = "300";
        args[truthOptions.length + 3] = "--seed";
        args[truthOptions.length + 4] = "4";
        args[truthOptions.length + 5] = "--out=" + first;
        CliTest.Result a = cli(args);
        assertEquals(0, a.status(), a.err());
        assertTrue(Files.isRegularFile(first.resolve("model.json")), a.out());
        Path second = tmp.resolve("second");
        CliTest.Result b = cli("simulate", "--model", first.resolve("model.json").toString(), "--samples", "300",
                "--out", second.toString());
        assertEquals(0, b.status(), b.err());
        assertEquals(Files.readString(first.resolve("data.csv")), Files.readString(second.resolve("data.csv")));
        assertEquals(Files.readString(first.resolve("truth.json")), Files.readString(second.resolve("truth.json")));
        assertEquals(Files.readString(first.resolve("model.json")), Files.readString(second.resolve("model.json")));
        Path third = tmp.resolve("third");
        CliTest.Result c = cli("simulate", "--model", first.resolve("model.json").toString(), "--samples", "300",
                "--seed", "99", "--out", third.toString());
        assertEquals(0, c.status(), c.err());
        assertNotEquals(Files.readString(first.resolve("data.csv")), Files.readString(third.resolve("data.csv")),
                "--seed draws new data from the same truth");
        assertEquals(Files.readString(first.resolve("truth.json")), Files.readString(third.resolve("truth.json")));
        for (Path p : new Path[] {first, second, third}) {
            try (var s = Files.list(p)) {
                s.forEach(f -> {
                    try {
                        Files.delete(f);
                    } catch (IOException e) {
                        throw new java.io.UncheckedIOException(e);
                    }
                });
            }
            Files.delete(p);
        }
    }

    @Test
    void theSameDataComesBackForEveryKindOfTruth() throws IOException {
        sameDataAgain("--graph", "erdos-renyi", "--set", "nodes=7", "--model", "linear-gaussian",
                "--set", "standardize=true", "--set", "shuffle_columns=true");
        sameDataAgain("--model", "additive-nonlinear", "--set", "nodes=5", "--set", "functions=mixed",
                "--hidden", "1", "--missing", "mar", "--set", "rate=0.1");
        sameDataAgain("--network", "chest-clinic");
        sameDataAgain("--model", "conditional-gaussian", "--set", "nodes=6");
    }

    @Test
    void aModelFileGivesTheWholeTruth() throws IOException {
        Path m = tmp.resolve("m.json");
        Files.writeString(m, "{}");
        CliTest.Result r = cli("simulate", "--model", m.toString(), "--graph", "layered", "--out",
                tmp.resolve("x").toString());
        assertEquals(2, r.status());
        assertTrue(r.err().contains("--graph: cannot be combined with a model file"), r.err());
        CliTest.Result missing = cli("simulate", "--model", tmp.resolve("none.json").toString(), "--out",
                tmp.resolve("x").toString());
        assertEquals(2, missing.status());
        assertTrue(missing.err().contains("no such file"), missing.err());
        CliTest.Result bad = cli("simulate", "--model", m.toString(), "--out", tmp.resolve("x").toString());
        assertEquals(2, bad.status());
        assertTrue(bad.err().contains("m.json, field 'model_file': missing"), bad.err());
        assertTrue(!Files.exists(tmp.resolve("x")), "nothing written for a bad model file");
    }

    @Test
    void aStudyReadsAModelFileAsItsTruth() throws IOException {
        Path model = tmp.resolve("model");
        CliTest.Result made = cli("simulate", "--model", "additive-nonlinear", "--set", "nodes=5", "--hidden", "1",
                "--missing", "mcar", "--set", "rate=0.1", "--samples", "50", "--seed", "8", "--out", model.toString());
        assertEquals(0, made.status(), made.err());
        Path study = Files.writeString(tmp.resolve("fixed.yaml"), """
                name: fixed-truth
                seed: 5
                replicates: 2
                truth:
                  model_file: model/model.json
                samples: [200]
                learners: [pc]
                metrics: [shd]
                """);
        CliTest.Result checked = cli("check", study.toString());
        assertEquals(0, checked.status(), checked.err());
        Path out = tmp.resolve("replicates");
        CliTest.Result r = cli("simulate", study.toString(), "--out", out.toString());
        assertEquals(0, r.status(), r.err());
        java.util.List<String> index = Files.readAllLines(out.resolve("replicates.csv"));
        assertEquals(3, index.size(), String.join("\n", index));
        int seedColumn = java.util.Arrays.asList(index.get(0).split(",")).indexOf("seed");
        int folderColumn = 0;
        Path[] folders = new Path[2];
        for (int i = 0; i < 2; i++) {
            String[] row = index.get(i + 1).split(",");
            folders[i] = out.resolve(row[folderColumn]);
            // every replicate has the model's own graph, hidden variable included
            assertEquals(Files.readString(model.resolve("truth.json")), Files.readString(folders[i].resolve("truth.json")));
            // and its data are those simulate --model draws with the replicate's seed
            Path again = tmp.resolve("again" + i);
            CliTest.Result a = cli("simulate", "--model", model.resolve("model.json").toString(), "--samples", "200",
                    "--seed", row[seedColumn], "--out", again.toString());
            assertEquals(0, a.status(), a.err());
            assertEquals(Files.readString(again.resolve("data.csv")), Files.readString(folders[i].resolve("data.csv")));
        }
        assertNotEquals(Files.readString(folders[0].resolve("data.csv")), Files.readString(folders[1].resolve("data.csv")),
                "each replicate draws new data from the fixed truth");
        Path clash = Files.writeString(tmp.resolve("clash.yaml"), """
                name: clash
                seed: 5
                replicates: 1
                truth:
                  model_file: model/model.json
                  graph: {family: erdos-renyi, nodes: 4}
                samples: [100]
                learners: [pc]
                metrics: [shd]
                """);
        CliTest.Result refused = cli("check", clash.toString());
        assertEquals(2, refused.status(), refused.err());
        assertTrue(refused.err().startsWith("error: ") && refused.err().contains("graph"), refused.err());
    }
}

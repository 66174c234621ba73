package dev.touchstone.harness.cli;

import org.junit.jupiter.api.DisplayName;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import picocli.CommandLine;

import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.Map;
import java.util.Set;
import java.util.TreeMap;
import java.util.TreeSet;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

/** One option vocabulary: the same name means the same thing, with the same default, in every command. */
class OptionVocabularyTest {

    @TempDir
    Path tmp;

    @Test
    @DisplayName("every option name shared by commands has one description (the mixins), except --out and --set,"
            + " whose target differs by command")
    void sharedOptionsDescribedOnce() {
        CommandLine cl = new CommandLine(new Main());
        Map<String, Set<String>> descriptions = new TreeMap<>();
        for (CommandLine sub : cl.getSubcommands().values()) {
            for (CommandLine.Model.OptionSpec o : sub.getCommandSpec().options()) {
                descriptions.computeIfAbsent(o.longestName(), k -> new TreeSet<>())
                        .add(String.join(" ", o.description()));
            }
        }
        for (String shared : new String[]{"--learners", "--plugins", "--seed", "--threads"}) {
            assertEquals(1, descriptions.get(shared).size(), shared + ": " + descriptions.get(shared));
        }
        for (CommandLine sub : cl.getSubcommands().values()) {
            assertTrue(sub.getCommandSpec().findOption("-V") == null, sub.getCommandName() + " has -V of its own");
        }
        assertTrue(cl.getCommandSpec().findOption("-V") != null, "the main command has -V");
    }

    @Test
    @DisplayName("learn takes ID.NAME=VALUE like calibrate, plain NAME=VALUE, and refuses another learner's prefix")
    void learnSettings() throws IOException {
        Path data = tmp.resolve("d.csv");
        StringBuilder sb = new StringBuilder("a,b\n");
        for (int i = 0; i < 40; i++) {
            sb.append(i % 7).append(',').append((i * 3) % 5).append('\n');
        }
        Files.writeString(data, sb.toString());
        CliTest.Result prefixed = CliTest.cli("learn", "--learner", "pc", "--data", data.toString(), "--continuous",
                "a,b", "--set", "pc.alpha=0.01");
        CliTest.Result plain = CliTest.cli("learn", "--learner", "pc", "--data", data.toString(), "--continuous",
                "a,b", "--set", "alpha=0.01");
        assertEquals(0, prefixed.status(), prefixed.err());
        assertEquals(plain.out(), prefixed.out());
        CliTest.Result other = CliTest.cli("learn", "--learner", "pc", "--data", data.toString(), "--continuous",
                "a,b", "--set", "ges.alpha=0.01");
        assertEquals(2, other.status());
        assertEquals("error: --set ges.alpha=0.01: this command runs 'pc'; write pc.alpha or just alpha",
                other.err().strip());
        CliTest.Result twice = CliTest.cli("learn", "--learner", "pc", "--data", data.toString(), "--continuous",
                "a,b", "--set", "pc.alpha=0.01", "--set", "alpha=0.05");
        assertEquals(2, twice.status());
        assertTrue(twice.err().contains("alpha is set twice"), twice.err());
    }
}

package dev.touchstone.harness.outside;

import dev.touchstone.harness.study.StudyException;
import org.junit.jupiter.api.DisplayName;
import org.junit.jupiter.api.Test;

import java.nio.file.Path;
import java.util.List;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

/** The learners file's {@code installed_on_workers} field (docs/outside-learners.md; common practice). */
class LearnersFileWorkersTest {

    private static final String ENTRY = "learners:\n  - id: m\n    command: [x, \"{data}\", \"{output}\"]\n"
            + "    returns: dag\n";

    private static List<CommandSpec> read(String text) {
        return LearnersFile.read("l.yaml", text, Path.of("/tmp"));
    }

    @Test
    @DisplayName("absent means this machine only; true and false are read; the key of runs does not change")
    void field() {
        CommandSpec plain = read(ENTRY).get(0);
        CommandSpec on = read(ENTRY + "    installed_on_workers: true\n").get(0);
        assertFalse(plain.onWorkers());
        assertTrue(on.onWorkers());
        assertFalse(read(ENTRY + "    installed_on_workers: false\n").get(0).onWorkers());
        assertEquals(plain.fingerprint(), on.fingerprint(), "where a command is installed does not change its result");
        assertEquals(plain.command(), on.command());
    }

    @Test
    @DisplayName("a value that is not true or false is refused at its line")
    void badValue() {
        StudyException e = assertThrows(StudyException.class,
                () -> read(ENTRY + "    installed_on_workers: maybe\n"));
        assertEquals(5, e.place().line());
        assertTrue(e.getMessage().contains("expected true or false"), e.getMessage());
    }
}

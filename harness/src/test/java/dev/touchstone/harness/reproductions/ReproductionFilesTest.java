package dev.touchstone.harness.reproductions;

import dev.touchstone.harness.study.Plan;
import org.junit.jupiter.api.DisplayName;
import org.junit.jupiter.api.Test;

import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.stream.Stream;

import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

/** Every bundled reproduction is a valid study with the header a reviewer needs, and has a quick version. */
class ReproductionFilesTest {

    private static List<Path> files() throws IOException {
        List<Path> out = new ArrayList<>();
        try (Stream<Path> s = Files.list(BundledStudy.FOLDER)) {
            s.filter(p -> p.toString().endsWith(".yaml")).sorted().forEach(out::add);
        }
        return out;
    }

    @Test
    @DisplayName("every full-scale reproduction reads and expands, names its publication, what it follows, what differs and the finding, and has a quick version")
    void fullScaleFiles() throws IOException {
        int full = 0;
        for (Path p : files()) {
            String name = p.getFileName().toString();
            Plan plan = BundledStudy.plan(p);
            assertFalse(plan.runs().isEmpty(), name);
            String text = Files.readString(p);
            if (name.endsWith("-quick.yaml")) {
                assertTrue(text.startsWith("# " + name.replace(".yaml", "") + ": the reduced grid of "), name);
                assertTrue(plan.runs().size() <= 200, name + " is quick: " + plan.runs().size() + " runs");
                continue;
            }
            full++;
            for (String part : List.of("# Followed:", "# Differs:", "# Finding checked:")) {
                assertTrue(text.contains(part), name + " says " + part);
            }
            assertTrue(text.matches("(?s)# [a-z-]+: .*\\(\\d{4}\\).*"), name + " names its publication with its year");
        }
        assertTrue(full >= 8, "at least eight reproductions, found " + full);
        for (String quick : List.of("high-dimensional-pc", "order-dependence", "conservative-colliders", "scale-artefacts",
                "notears-design", "missing-data", "nonlinear-additive", "permutation-search")) {
            assertTrue(Files.isRegularFile(BundledStudy.FOLDER.resolve(quick + "-quick.yaml")), quick);
        }
    }
}

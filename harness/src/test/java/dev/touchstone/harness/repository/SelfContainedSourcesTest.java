package dev.touchstone.harness.repository;

import org.junit.jupiter.api.DisplayName;
import org.junit.jupiter.api.Test;

import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.Set;
import java.util.regex.Pattern;
import java.util.stream.Stream;

import static org.junit.jupiter.api.Assertions.assertTrue;

/**
 * The repository's code, docs and scripts stand on their own: no reference to notes kept outside
 * it (a design document's numbered sections, the planning notes beside the checkout) and no
 * absolute path of the machine it was written on. A reader of a fresh clone has neither, so such a
 * reference explains nothing; the source it relayed must be named instead.
 */
class SelfContainedSourcesTest {

    private static final Path ROOT = Path.of("..").toAbsolutePath().normalize();
    private static final Set<String> SKIPPED_FOLDERS = Set.of("target", ".git", "node_modules");
    private static final Set<String> CHECKED_SUFFIXES = Set.of(".java", ".md", ".yaml", ".yml", ".sh", ".py",
            ".xml", ".properties", ".txt");

    /** Built from pieces so that this file does not match itself. */
    private static final Pattern OUTSIDE = Pattern.compile(String.join("|",
            "design " + "§", "\\.\\./" + "shared", "\\b(?:checks|style|libraries|design)" + "\\.md\\b",
            "/" + "work/", "/" + "root/", "/" + "home/"));

    @Test
    @DisplayName("no file of the repository cites a document outside it or an absolute path of the development machine")
    void noOutsideReferences() throws IOException {
        List<String> found = new ArrayList<>();
        int files = 0;
        try (Stream<Path> walk = Files.walk(ROOT)) {
            for (Path p : (Iterable<Path>) walk::iterator) {
                if (!Files.isRegularFile(p) || skipped(p) || !checked(p)) {
                    continue;
                }
                files++;
                List<String> lines = Files.readAllLines(p, StandardCharsets.UTF_8);
                for (int i = 0; i < lines.size(); i++) {
                    if (OUTSIDE.matcher(lines.get(i)).find()) {
                        found.add(ROOT.relativize(p) + ":" + (i + 1) + ": " + lines.get(i).strip());
                    }
                }
            }
        }
        assertTrue(files > 500, "the walk found the repository's files (" + files + ")");
        assertTrue(found.isEmpty(), "references outside the repository:\n" + String.join("\n", found));
    }

    private static boolean skipped(Path p) {
        for (Path part : ROOT.relativize(p)) {
            if (SKIPPED_FOLDERS.contains(part.toString())) {
                return true;
            }
        }
        return false;
    }

    private static boolean checked(Path p) {
        String name = p.getFileName().toString();
        int dot = name.lastIndexOf('.');
        return dot >= 0 && CHECKED_SUFFIXES.contains(name.substring(dot));
    }
}

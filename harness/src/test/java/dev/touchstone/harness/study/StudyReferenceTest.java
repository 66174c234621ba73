package dev.touchstone.harness.study;

import org.junit.jupiter.api.DisplayName;
import org.junit.jupiter.api.Test;

import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

class StudyReferenceTest {

    static final Path PAGE = Path.of("..", "docs", "study-files.md");

    @Test
    @DisplayName("docs/study-files.md is what the descriptors generate (regenerate with -Dtouchstone.regenerateDocs=true)")
    void pageIsCurrent() throws IOException {
        String expected = StudyReference.markdown(new GeneratorTruthCatalog(), new RegistryMetricCatalog());
        if (Boolean.getBoolean("touchstone.regenerateDocs")) {
            Files.writeString(PAGE, expected);
        }
        assertTrue(Files.exists(PAGE), "missing " + PAGE.toAbsolutePath());
        assertEquals(expected, Files.readString(PAGE), "docs/study-files.md is stale: regenerate it with "
                + "mvn -pl harness -am verify -Dtest=StudyReferenceTest -Dsurefire.failIfNoSpecifiedTests=false"
                + " -Dtouchstone.regenerateDocs=true");
        for (String field : StudyFields.names()) {
            assertTrue(expected.contains("| `" + field + "` |"), field);
        }
    }
}

package dev.touchstone.harness.outside;

import dev.touchstone.harness.catalog.LearnerCatalog;
import org.junit.jupiter.api.DisplayName;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

import java.io.IOException;
import java.io.OutputStream;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.jar.JarEntry;
import java.util.jar.JarOutputStream;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertNull;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

class PluginLoaderTest {

    @TempDir
    Path tmp;

    @Test
    @DisplayName("a jar in --plugins DIR listing a Learner service joins the catalogue as a plug-in")
    void findsPlugin() throws IOException {
        Path dir = tmp.resolve("plugins");
        Files.createDirectories(dir);
        try (OutputStream f = Files.newOutputStream(dir.resolve("mine.jar")); JarOutputStream jar = new JarOutputStream(f)) {
            jar.putNextEntry(new JarEntry("META-INF/services/dev.touchstone.core.learner.Learner"));
            jar.write((PluginTestLearner.class.getName() + "\n").getBytes(StandardCharsets.UTF_8));
            jar.closeEntry();
        }
        assertNull(LearnerCatalog.builtIn().find("plugged-in-test"), "not found without the plug-in folder");
        LearnerCatalog.Builder b = LearnerCatalog.builder();
        PluginLoader.addPlugins(b, dir);
        LearnerCatalog c = b.build();
        LearnerCatalog.Entry e = c.find("plugged-in-test");
        assertEquals(LearnerCatalog.Origin.PLUG_IN, e.origin());
        assertTrue(e.source().contains("plugins"));
    }

    @Test
    @DisplayName("a plug-in folder that is missing or holds no jar is refused")
    void refusesEmpty() throws IOException {
        assertThrows(IllegalArgumentException.class, () -> PluginLoader.addPlugins(LearnerCatalog.builder(), tmp.resolve("none")));
        Files.createDirectories(tmp.resolve("empty"));
        IllegalArgumentException e = assertThrows(IllegalArgumentException.class,
                () -> PluginLoader.addPlugins(LearnerCatalog.builder(), tmp.resolve("empty")));
        assertTrue(e.getMessage().contains("holds no .jar files"), e.getMessage());
    }
}

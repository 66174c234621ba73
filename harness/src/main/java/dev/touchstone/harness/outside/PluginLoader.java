package dev.touchstone.harness.outside;

import dev.touchstone.harness.catalog.LearnerCatalog;

import java.io.IOException;
import java.io.UncheckedIOException;
import java.net.MalformedURLException;
import java.net.URL;
import java.net.URLClassLoader;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.stream.Stream;

/**
 * Finds Java plug-in learners: every jar in a folder goes on one class loader (child of the
 * tool's), and the {@code Learner} implementations it lists in
 * {@code META-INF/services/dev.touchstone.core.learner.Learner} join the catalogue. A
 * plug-in depends on {@code touchstone-core} only.
 */
public final class PluginLoader {

    private PluginLoader() {
    }

    /** Adds the plug-ins in {@code dir} to a catalogue under construction. */
    public static void addPlugins(LearnerCatalog.Builder catalog, Path dir) {
        if (!Files.isDirectory(dir)) {
            throw new IllegalArgumentException("the plug-in folder " + dir + " does not exist or is not a folder");
        }
        List<URL> jars = new ArrayList<>();
        try (Stream<Path> s = Files.list(dir)) {
            for (Path p : s.sorted().toList()) {
                if (p.getFileName().toString().endsWith(".jar")) {
                    jars.add(p.toUri().toURL());
                }
            }
        } catch (MalformedURLException e) {
            throw new IllegalArgumentException("a plug-in path cannot be used: " + e.getMessage(), e);
        } catch (IOException e) {
            throw new UncheckedIOException("cannot list the plug-in folder " + dir, e);
        }
        if (jars.isEmpty()) {
            throw new IllegalArgumentException("the plug-in folder " + dir + " holds no .jar files");
        }
        ClassLoader loader = new URLClassLoader(jars.toArray(new URL[0]), PluginLoader.class.getClassLoader());
        catalog.addServices(loader, LearnerCatalog.Origin.PLUG_IN, dir.toString());
    }
}

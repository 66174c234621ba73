package dev.touchstone.harness.architecture;

import dev.touchstone.core.graph.Graph;
import dev.touchstone.generators.graphs.GraphFamily;
import dev.touchstone.harness.BadInputException;
import dev.touchstone.learners.independence.Hsic;
import dev.touchstone.metrics.results.RunResult;
import dev.touchstone.reports.HtmlReport;
import org.junit.jupiter.api.DisplayName;
import org.junit.jupiter.api.Test;

import java.io.IOException;
import java.io.UncheckedIOException;
import java.lang.reflect.Constructor;
import java.lang.reflect.Modifier;
import java.net.URISyntaxException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.Enumeration;
import java.util.List;
import java.util.Set;
import java.util.TreeSet;
import java.util.jar.JarEntry;
import java.util.jar.JarFile;
import java.util.stream.Stream;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

/**
 * No public constructor takes more than five positional parameters: past five, two values of the
 * same type are easily swapped at a call site and the compiler cannot tell. Wider values get a
 * builder or are made of small named records (common practice; the rule is the project's own).
 *
 * <p>Scans the compiled main classes of every module the harness sees (core, generators, metrics,
 * learners, reports, harness), found from one class of each, whether the build hands them over as
 * a classes directory or as a jar. Records with more than five components are caught whatever
 * their visibility: every caller of a record's canonical constructor, even inside its package,
 * lists its fields by position.
 */
class PositionalParametersTest {

    /** The most positional parameters a public constructor may take. */
    static final int LIMIT = 5;

    /**
     * Types still waiting for their fix, by binary name. Each must still offend (a fixed type has
     * to leave the list), so the list can only shrink.
     */
    static final Set<String> NOT_YET_FIXED = Set.of();

    /** One main class of each module, to find where the module's classes are. */
    private static final List<Class<?>> MODULES = List.of(Graph.class, GraphFamily.class, RunResult.class,
            Hsic.class, HtmlReport.class, BadInputException.class);

    @Test
    @DisplayName("no public constructor and no record in the main classes of any module takes more than five positional parameters")
    void noWidePublicConstructors() {
        List<String> names = new ArrayList<>();
        for (Class<?> anchor : MODULES) {
            List<String> found = classNames(anchor);
            // a module whose classes were not found would pass for the wrong reason
            assertTrue(found.contains(anchor.getName()), "the classes of " + anchor.getName() + "'s module were not found");
            assertTrue(found.size() > 10, anchor.getName() + "'s module shows only " + found.size() + " classes");
            names.addAll(found);
        }
        Set<String> offenders = offenders(names);
        List<String> unlisted = new ArrayList<>();
        for (String o : offenders) {
            if (!NOT_YET_FIXED.contains(typeOf(o))) {
                unlisted.add(o);
            }
        }
        assertTrue(unlisted.isEmpty(), "public constructors and records with more than " + LIMIT + " parameters (give the type"
                + " a builder or group its fields into small records):\n  " + String.join("\n  ", unlisted));
        Set<String> stillOffending = new TreeSet<>();
        for (String o : offenders) {
            stillOffending.add(typeOf(o));
        }
        Set<String> fixed = new TreeSet<>(NOT_YET_FIXED);
        fixed.removeAll(stillOffending);
        assertTrue(fixed.isEmpty(), "fixed, so take them off NOT_YET_FIXED: " + fixed);
    }

    @Test
    @DisplayName("the scan reports wide public constructors and records of any visibility, and passes the rest")
    void scanFindsOffenders() {
        List<String> names = new ArrayList<>();
        for (Class<?> c : WideFixtures.class.getDeclaredClasses()) {
            names.add(c.getName());
        }
        names.add(WideFixtures.Holder.Inner.class.getName());
        assertEquals(Set.of(WideFixtures.Wide.class.getName() + "(int, int, int, int, int, int)",
                WideFixtures.WideRecord.class.getName() + "(String, String, String, String, String, String)",
                WideFixtures.Holder.Inner.class.getName() + "(long, long, long, long, long, long)",
                WideFixtures.class.getName() + "$HiddenRecord(int, int, int, int, int, int)"), offenders(names));
    }

    /**
     * The constructors with more than {@link #LIMIT} parameters among the classes named (binary
     * names), as {@code type(parameter types)}: public constructors of public types (a type counts
     * as public when it and every type enclosing it are public: only then can code outside call
     * it), and the canonical constructor of a record of any visibility, since a record's fields
     * are its constructor's positions.
     */
    static Set<String> offenders(List<String> classNames) {
        Set<String> out = new TreeSet<>();
        ClassLoader loader = PositionalParametersTest.class.getClassLoader();
        for (String name : classNames) {
            Class<?> c;
            try {
                c = Class.forName(name, false, loader);
            } catch (ClassNotFoundException | LinkageError e) {
                throw new AssertionError("cannot load " + name + ": " + e, e);
            }
            if (c.isSynthetic() || c.isAnonymousClass() || c.isLocalClass()) {
                continue;
            }
            for (Constructor<?> k : c.getDeclaredConstructors()) {
                boolean callable = Modifier.isPublic(k.getModifiers()) && reachable(c);
                // a record's canonical constructor is positional whoever may call it
                boolean canonical = c.isRecord() && k.getParameterCount() == c.getRecordComponents().length;
                if (!k.isSynthetic() && (callable || canonical) && k.getParameterCount() > LIMIT) {
                    List<String> types = new ArrayList<>();
                    for (Class<?> t : k.getParameterTypes()) {
                        types.add(t.getSimpleName());
                    }
                    out.add(name + "(" + String.join(", ", types) + ")");
                }
            }
        }
        return out;
    }

    private static boolean reachable(Class<?> c) {
        for (Class<?> k = c; k != null; k = k.getEnclosingClass()) {
            if (!Modifier.isPublic(k.getModifiers())) {
                return false;
            }
        }
        return true;
    }

    private static String typeOf(String offender) {
        return offender.substring(0, offender.indexOf('('));
    }

    /** The binary names of the classes in the classes directory or jar that holds {@code anchor}. */
    static List<String> classNames(Class<?> anchor) {
        Path where;
        try {
            where = Path.of(anchor.getProtectionDomain().getCodeSource().getLocation().toURI());
        } catch (URISyntaxException e) {
            throw new IllegalStateException("no location for " + anchor.getName(), e);
        }
        List<String> out = new ArrayList<>();
        try {
            if (Files.isDirectory(where)) {
                try (Stream<Path> files = Files.walk(where)) {
                    files.filter(f -> isClass(f.toString())).forEach(f ->
                            out.add(binaryName(where.relativize(f).toString().replace(f.getFileSystem()
                                    .getSeparator(), "/"))));
                }
            } else {
                try (JarFile jar = new JarFile(where.toFile())) {
                    for (Enumeration<JarEntry> e = jar.entries(); e.hasMoreElements(); ) {
                        String entry = e.nextElement().getName();
                        if (isClass(entry) && !entry.startsWith("META-INF/")) {
                            out.add(binaryName(entry));
                        }
                    }
                }
            }
        } catch (IOException e) {
            throw new UncheckedIOException("cannot list the classes in " + where, e);
        }
        out.sort(String::compareTo);
        return out;
    }

    private static boolean isClass(String path) {
        return path.endsWith(".class") && !path.endsWith("module-info.class") && !path.endsWith("package-info.class");
    }

    private static String binaryName(String relativePath) {
        return relativePath.substring(0, relativePath.length() - ".class".length()).replace('/', '.');
    }
}

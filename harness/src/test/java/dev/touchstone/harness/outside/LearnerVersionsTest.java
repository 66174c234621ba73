package dev.touchstone.harness.outside;

import dev.touchstone.harness.study.StudyException;
import org.junit.jupiter.api.DisplayName;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

import java.io.IOException;
import java.io.InputStream;
import java.io.OutputStream;
import java.net.URL;
import java.net.URLClassLoader;
import java.nio.file.Files;
import java.nio.file.Path;
import java.security.MessageDigest;
import java.util.HexFormat;
import java.util.jar.Attributes;
import java.util.jar.JarEntry;
import java.util.jar.JarOutputStream;
import java.util.jar.Manifest;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertNotEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

/** Learner versions: a plug-in jar's manifest or digest, an outside command's declared version or digest. */
class LearnerVersionsTest {

    @TempDir
    Path tmp;

    /** A class with no dependencies, copied into test jars and loaded from them alone. */
    public static final class Marker {
    }

    private Path jar(String name, String implementationVersion) throws IOException {
        Manifest m = new Manifest();
        m.getMainAttributes().put(Attributes.Name.MANIFEST_VERSION, "1.0");
        if (implementationVersion != null) {
            m.getMainAttributes().put(Attributes.Name.IMPLEMENTATION_VERSION, implementationVersion);
        }
        Path file = tmp.resolve(name);
        String entry = Marker.class.getName().replace('.', '/') + ".class";
        try (OutputStream f = Files.newOutputStream(file); JarOutputStream jar = new JarOutputStream(f, m);
             InputStream in = Marker.class.getClassLoader().getResourceAsStream(entry)) {
            jar.putNextEntry(new JarEntry(entry));
            in.transferTo(jar);
            jar.closeEntry();
        }
        return file;
    }

    private static Class<?> load(Path jar) throws Exception {
        // The platform loader as parent: the class comes from the jar, not from the test class path.
        URLClassLoader loader = new URLClassLoader(new URL[] {jar.toUri().toURL()}, ClassLoader.getPlatformClassLoader());
        return loader.loadClass(Marker.class.getName());
    }

    @Test
    @DisplayName("a plug-in's version is its jar manifest's Implementation-Version (JAR File Specification)")
    void manifestVersion() throws Exception {
        assertEquals("3.1.4", LearnerVersions.pluginVersion(load(jar("with.jar", "3.1.4"))));
    }

    @Test
    @DisplayName("without a manifest version, a plug-in's version is the SHA-256 of its jar (checked with the JDK's digest)")
    void jarDigest() throws Exception {
        Path jar = jar("without.jar", null);
        String expected = "sha256:" + HexFormat.of().formatHex(MessageDigest.getInstance("SHA-256")
                .digest(Files.readAllBytes(jar))).substring(0, 16);
        assertEquals(expected, LearnerVersions.pluginVersion(load(jar)));
    }

    private static String learners(String extra) {
        return "learners:\n  - id: m\n    command: [python3, \"{dir}/m.py\", \"{data}\", \"{output}\"]\n"
                + "    returns: dag\n" + extra;
    }

    @Test
    @DisplayName("an outside command's version: the declared one, else a digest that follows the script's content")
    void commandVersion() throws IOException {
        Path dir = tmp.resolve("cmd");
        Files.createDirectories(dir);
        Files.writeString(dir.resolve("m.py"), "print('a')\n");
        CommandSpec declared = LearnersFile.read("l.yaml", learners("    version: \"2.1\"\n"), dir).get(0);
        assertEquals("2.1", LearnerVersions.commandVersion(declared));

        CommandSpec plain = LearnersFile.read("l.yaml", learners(""), dir).get(0);
        String v1 = LearnerVersions.commandVersion(plain);
        assertTrue(v1.matches("sha256:[0-9a-f]{16}"), v1);
        assertEquals(v1, LearnerVersions.commandVersion(plain), "the same files give the same version");
        Files.writeString(dir.resolve("m.py"), "print('b')\n");
        assertNotEquals(v1, LearnerVersions.commandVersion(plain), "editing the script changes the version");
        assertEquals(dir.resolve("m.py"), LearnerVersions.namedFile("{dir}/m.py", dir));
        assertEquals(null, LearnerVersions.namedFile("{data}", dir));
        assertEquals(null, LearnerVersions.namedFile("python3", dir), "a program on PATH is not a file of the command");
    }

    @Test
    @DisplayName("a malformed version field is refused at its line")
    void badVersionField() {
        StudyException e = assertThrows(StudyException.class,
                () -> LearnersFile.read("l.yaml", learners("    version: [1, 2]\n"), tmp));
        assertTrue(e.getMessage().contains("l.yaml:5:14: learners[0].version:"), e.getMessage());
        assertTrue(e.getMessage().contains("expected the version as text"), e.getMessage());
    }
}

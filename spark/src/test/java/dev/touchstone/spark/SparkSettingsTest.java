package dev.touchstone.spark;

import org.junit.jupiter.api.DisplayName;
import org.junit.jupiter.api.Test;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

/** Master URLs in Spark's documented forms (Spark "Submitting Applications", master URLs). */
class SparkSettingsTest {

    @Test
    @DisplayName("local masters get retries (local[N] → local[N,F]); explicit F and cluster masters are kept")
    void retriesOnLocal() {
        assertEquals("local[2,4]", SparkSettings.withRetries("local[2]", 4));
        assertEquals("local[*,3]", SparkSettings.withRetries("local[*]", 3));
        assertEquals("local[1,4]", SparkSettings.withRetries("local", 4));
        assertEquals("local[2,1]", SparkSettings.withRetries("local[2,1]", 4));
        assertEquals("spark://h:7077", SparkSettings.withRetries("spark://h:7077", 4));
        assertEquals("local[2,4]", SparkSettings.conf("local[2]", "s").get("spark.master"));
    }

    @Test
    @DisplayName("local forms are recognised; a malformed local master or a blank one is refused in one line")
    void check() {
        assertTrue(SparkSettings.isLocal(null));
        assertTrue(SparkSettings.isLocal("local[*]"));
        assertFalse(SparkSettings.isLocal("yarn"));
        assertFalse(SparkSettings.isLocal("spark://h:7077"));
        IllegalArgumentException e = assertThrows(IllegalArgumentException.class, () -> SparkSettings.check("local[x]"));
        assertTrue(e.getMessage().contains("local[N]"), e.getMessage());
        assertThrows(IllegalArgumentException.class, () -> SparkSettings.check(" "));
        SparkSettings.check("yarn");
    }

    @Test
    @DisplayName("a cluster master gets Touchstone's jar files as spark.jars unless set (Spark configuration docs:"
            + " spark.jars, jars for the driver and executor class paths); a local master gets none")
    void jarsForExecutors() {
        String jars = String.join(",", SparkSettings.codeJars());
        // Built by the reactor, the harness is a jar file and the engine's classes a folder.
        assertTrue(jars.endsWith(".jar") && !jars.contains("target/classes"), jars);
        assertEquals(jars, SparkSettings.conf("spark://127.0.0.1:7077", "s").get("spark.jars"));
        assertFalse(SparkSettings.conf("local[2]", "s").contains("spark.jars"));
        System.setProperty("spark.jars", "/elsewhere/mine.jar");
        try {
            assertEquals("/elsewhere/mine.jar", SparkSettings.conf("spark://127.0.0.1:7077", "s").get("spark.jars"));
        } finally {
            System.clearProperty("spark.jars");
        }
    }
}

package dev.touchstone.spark;

import dev.touchstone.harness.execution.EngineProvider;
import org.apache.spark.SparkConf;

import java.net.URISyntaxException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.security.CodeSource;
import java.util.ArrayList;
import java.util.List;
import java.util.regex.Matcher;
import java.util.regex.Pattern;

/**
 * The Spark configuration of a session: the master (from {@code --master}, else
 * {@code spark.master} as set by {@code spark-submit}, else {@code local[*]}), retries of
 * dead tasks ({@code spark.task.maxFailures}, default 4, also on a local master, where Spark
 * would otherwise not retry), the task size ({@code spark.touchstone.runsPerTask}) and Spark's
 * log level ({@code spark.touchstone.logLevel}). On a cluster master the executors get
 * Touchstone's own jars ({@code spark.jars}) unless {@code spark-submit} has named them. Any {@code spark.*} system property (as
 * {@code spark-submit --conf} sets) is taken as usual.
 */
final class SparkSettings {

    static final String RUNS_PER_TASK = "spark.touchstone.runsPerTask";
    static final String MAX_FAILURES = "spark.task.maxFailures";
    /** Spark's log level during the session (default WARN: Spark's INFO lines would bury the progress lines). */
    static final String LOG_LEVEL = "spark.touchstone.logLevel";
    private static final Pattern LOCAL = Pattern.compile("local(\\[(\\*|\\d+)(,(\\d+))?])?");

    private SparkSettings() {
    }

    /** Whether this master runs every task in the driver's JVM (null means the default, which is local). */
    static boolean isLocal(String master) {
        return master == null || LOCAL.matcher(master).matches();
    }

    /** Checks a master given on the command line; local forms are checked fully, others left to Spark. */
    static void check(String master) {
        if (master == null) {
            return;
        }
        if (master.isBlank() || master.startsWith("local") && !LOCAL.matcher(master).matches()) {
            throw new IllegalArgumentException("--master '" + master + "' is not a Spark master; use local, local[N],"
                    + " local[*], spark://HOST:PORT, yarn or k8s://URL");
        }
    }

    /** The configuration: defaults first, then what the session and the command line say. */
    static SparkConf conf(String master, String studyName) {
        SparkConf conf = new SparkConf();
        conf.setIfMissing("spark.app.name", "touchstone " + studyName);
        conf.setIfMissing(MAX_FAILURES, "4");
        conf.setIfMissing("spark.ui.showConsoleProgress", "false");
        // Task results are journal lines handed on as each task ends, not one collected
        // result; Spark's default cap of 1g on their total would stop a study of about
        // 1.3 million runs (800 bytes a line), so the cap is off unless the user sets one.
        conf.setIfMissing("spark.driver.maxResultSize", "0");
        String m = master != null ? master : conf.get("spark.master", "local[*]");
        if (isLocal(m)) {
            conf.setIfMissing("spark.ui.enabled", "false");
            conf.setIfMissing("spark.driver.host", "127.0.0.1");
            conf.setIfMissing("spark.driver.bindAddress", "127.0.0.1");
            m = withRetries(m, conf.getInt(MAX_FAILURES, 4));
        } else if (!conf.contains("spark.jars")) {
            // Started by ./touchstone rather than spark-submit, nobody has told the executors
            // where Touchstone's classes are: without this every task fails with
            // ClassNotFoundException (seen on a standalone master).
            List<String> jars = codeJars();
            if (!jars.isEmpty()) {
                conf.set("spark.jars", String.join(",", jars));
            }
        }
        conf.setMaster(m);
        return conf;
    }

    /** {@code local[N]} → {@code local[N,F]}: Spark retries tasks on a local master only when told how often. */
    static String withRetries(String localMaster, int maxFailures) {
        Matcher mt = LOCAL.matcher(localMaster);
        if (!mt.matches() || mt.group(4) != null) {
            return localMaster;
        }
        String threads = mt.group(2) == null ? "1" : mt.group(2);
        return "local[" + threads + "," + maxFailures + "]";
    }

    /**
     * The jar files holding Touchstone's code on the driver: the harness's (touchstone.jar,
     * with its libraries), found from the engine seam this module implements rather than from
     * the command line's classes, and this module's. Class folders (as in the build's own tests) are
     * left out: Spark ships jar files only.
     */
    static List<String> codeJars() {
        List<String> jars = new ArrayList<>();
        for (Class<?> c : List.of(EngineProvider.class, SparkSettings.class)) {
            CodeSource source = c.getProtectionDomain().getCodeSource();
            if (source == null) {
                continue;
            }
            try {
                Path p = Path.of(source.getLocation().toURI());
                if (Files.isRegularFile(p) && !jars.contains(p.toString())) {
                    jars.add(p.toString());
                }
            } catch (URISyntaxException | IllegalArgumentException e) {
                // not a file location: nothing this session can ship
            }
        }
        return jars;
    }
}

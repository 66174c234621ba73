package dev.touchstone.spark;

import dev.touchstone.harness.execution.Journal;
import org.junit.jupiter.api.AfterAll;
import org.junit.jupiter.api.BeforeAll;
import org.junit.jupiter.api.DisplayName;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.condition.EnabledIfEnvironmentVariable;
import org.junit.jupiter.api.io.TempDir;

import java.io.IOException;
import java.io.UncheckedIOException;
import java.net.InetSocketAddress;
import java.net.ServerSocket;
import java.net.Socket;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.Map;
import java.util.Optional;
import java.util.concurrent.CompletableFuture;
import java.util.concurrent.TimeUnit;
import java.util.jar.JarEntry;
import java.util.jar.JarOutputStream;
import java.util.stream.Stream;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

/**
 * Opt-in ({@code TOUCHSTONE_SPARK_STANDALONE=1}, after {@code mvn -B -q -pl spark -am package
 * -DskipTests}, which fills {@code spark/target/lib}): the engine on a real Spark standalone
 * master with one worker, all on 127.0.0.1, the driver in this JVM. The worker launches its
 * executor as a separate JVM from the cluster's own class path, so tasks are serialised, the
 * engine's classes reach the executor through {@code spark.jars} and a killed executor is a
 * lost JVM, none of which {@code local[N]} exercises. Reference: the local engine's runs.csv
 * (results do not depend on where runs are performed); retries after a lost
 * executor are Spark's documented behaviour for {@code spark.task.maxFailures}. The master and
 * the worker are stopped after the class, and live at most ten minutes in any case.
 */
@EnabledIfEnvironmentVariable(named = StandaloneClusterTest.ENABLE, matches = "1", disabledReason = "opt-in: set "
        + StandaloneClusterTest.ENABLE + "=1 to run the engine on a loopback Spark standalone cluster")
class StandaloneClusterTest {

    static final String ENABLE = "TOUCHSTONE_SPARK_STANDALONE";
    private static final String STUDY = "name: standalone-test\nseed: 11\nreplicates: %d\n"
            + "truth:\n  graph: {family: erdos-renyi, nodes: %s, mean_degree: 3}\n  model: {kind: linear-gaussian}\n"
            + "samples: %s\nlearners:\n  - {id: pc, use: pc, with: {alpha: [0.001, 0.01, 0.05]}}\n"
            + "  - {id: empty, use: empty}\nmetrics: [shd, adjacency_f1, orientation_f1, seconds]\n"
            + "limits: {seconds: 60}\ncompare_to: empty\n";
    private static final List<String> DRIVER_PROPERTIES = List.of("spark.jars", "spark.driver.host",
            "spark.driver.bindAddress", SparkSettings.RUNS_PER_TASK);

    @TempDir
    static Path tmp;
    private static final List<Process> DAEMONS = new ArrayList<>();
    private static String master;

    @BeforeAll
    static void startCluster() throws IOException, InterruptedException {
        Path lib = Path.of("target/lib").toAbsolutePath();
        Path touchstoneJar = Path.of("../harness/target/touchstone.jar").toAbsolutePath().normalize();
        assertTrue(Files.isDirectory(lib) && Files.isRegularFile(touchstoneJar),
                "build first: mvn -B -q -pl spark -am package -DskipTests (needs " + lib + " and " + touchstoneJar + ")");
        Path home = Files.createDirectories(tmp.resolve("spark-home"));
        Files.createSymbolicLink(home.resolve("jars"), lib);
        int port = freePort();
        master = "spark://127.0.0.1:" + port;
        DAEMONS.add(daemon(home, "master", "org.apache.spark.deploy.master.Master", "--host", "127.0.0.1",
                "--port", String.valueOf(port), "--webui-port", String.valueOf(freePort())));
        awaitPort(port);
        DAEMONS.add(daemon(home, "worker", "org.apache.spark.deploy.worker.Worker", master, "--host", "127.0.0.1",
                "--cores", "1", "--memory", "1g", "--work-dir", Files.createDirectories(tmp.resolve("work")).toString(),
                "--webui-port", String.valueOf(freePort())));
        // The driver runs here: it binds to loopback and ships Touchstone's classes as jars.
        System.setProperty("spark.jars", touchstoneJar + "," + jarOf(Path.of("target/classes"), tmp.resolve("engine.jar")));
        System.setProperty("spark.driver.host", "127.0.0.1");
        System.setProperty("spark.driver.bindAddress", "127.0.0.1");
    }

    @AfterAll
    static void stopCluster() throws InterruptedException {
        DRIVER_PROPERTIES.forEach(System::clearProperty);
        for (int i = DAEMONS.size() - 1; i >= 0; i--) {
            Process p = DAEMONS.get(i);
            p.descendants().forEach(ProcessHandle::destroy);
            p.destroy();
            if (!p.waitFor(20, TimeUnit.SECONDS)) {
                p.destroyForcibly();
            }
        }
        DAEMONS.clear();
    }

    private static Process daemon(Path home, String name, String mainClass, String... args) throws IOException {
        List<String> command = new ArrayList<>();
        if (Files.isExecutable(Path.of("/usr/bin/timeout"))) {
            command.addAll(List.of("/usr/bin/timeout", "600"));
        }
        command.add(Path.of(System.getProperty("java.home"), "bin", "java").toString());
        command.add("-Xmx512m");
        // the JDK opens of Spark 4 on Java 17, as the build gives this JVM (pom.xml, spark.java.options)
        Stream.of(System.getProperty("touchstone.spark.options", "").split(" ")).filter(o -> !o.isBlank())
                .forEach(command::add);
        command.addAll(List.of("-cp", home.resolve("jars") + "/*", mainClass));
        command.addAll(List.of(args));
        ProcessBuilder pb = new ProcessBuilder(command).redirectErrorStream(true)
                .redirectOutput(tmp.resolve(name + ".log").toFile());
        Map<String, String> env = pb.environment();
        env.put("SPARK_HOME", home.toString());
        env.put("SPARK_SCALA_VERSION", "2.13");
        env.put("SPARK_LOCAL_IP", "127.0.0.1");
        env.put("SPARK_LOCAL_HOSTNAME", "localhost");
        return pb.start();
    }

    private static int freePort() throws IOException {
        try (ServerSocket s = new ServerSocket(0, 1, java.net.InetAddress.getLoopbackAddress())) {
            return s.getLocalPort();
        }
    }

    private static void awaitPort(int port) throws InterruptedException {
        for (int i = 0; i < 240; i++) {
            try (Socket s = new Socket()) {
                s.connect(new InetSocketAddress("127.0.0.1", port), 500);
                return;
            } catch (IOException notYet) {
                Thread.sleep(250);
            }
        }
        throw new IllegalStateException("the Spark master did not open port " + port + " within a minute");
    }

    /** A jar of a class folder: Spark ships jar files only, and the build's tests run before the module's jar exists. */
    private static Path jarOf(Path classes, Path jar) throws IOException {
        try (JarOutputStream out = new JarOutputStream(Files.newOutputStream(jar)); Stream<Path> files = Files.walk(classes)) {
            for (Path f : (Iterable<Path>) files.filter(Files::isRegularFile)::iterator) {
                out.putNextEntry(new JarEntry(classes.relativize(f).toString().replace('\\', '/')));
                Files.copy(f, out);
                out.closeEntry();
            }
        }
        return jar;
    }

    private static Path study(String name, int replicates, String nodes, String samples) throws IOException {
        Path p = tmp.resolve(name + ".yaml");
        Files.writeString(p, String.format(java.util.Locale.ROOT, STUDY, replicates, nodes, samples));
        return p;
    }

    private static SparkEngineTest.Result run(Path study, Path out, String... engine) {
        List<String> args = new ArrayList<>(List.of("run", study.toString(), "--out", out.toString(), "--quiet"));
        args.addAll(List.of(engine));
        return SparkEngineTest.cli(args.toArray(String[]::new));
    }

    private static long lines(Path out) {
        try {
            Path journal = out.resolve(Journal.FILE_NAME);
            return Files.exists(journal) ? Files.readAllLines(journal).size() : 0;
        } catch (IOException e) {
            throw new UncheckedIOException(e);
        }
    }

    /** The study run by the local engine (2 threads) into {@code out}: the reference. */
    private static Path locally(Path study, String out) {
        SparkEngineTest.Result r = run(study, tmp.resolve(out), "--threads", "2");
        assertEquals(0, r.status(), r.err());
        return tmp.resolve(out);
    }

    /** Same runs.csv apart from timing columns, and one journal line per run in both. */
    private static void assertSameRuns(Path local, Path cluster) throws IOException {
        assertEquals(SparkEngineTest.withoutTimings(local.resolve("runs.csv")),
                SparkEngineTest.withoutTimings(cluster.resolve("runs.csv")));
        assertEquals(lines(local), lines(cluster), "each run journaled once");
    }

    @Test
    @DisplayName("a standalone master gives the local engine's runs.csv apart from timing columns")
    void standaloneEqualsLocal() throws IOException {
        Path study = study("small", 4, "[5, 8]", "[100, 400, oracle]");
        Path local = locally(study, "local");
        SparkEngineTest.Result cluster = run(study, tmp.resolve("cluster"), "--engine", "spark", "--master", master);
        assertEquals(0, cluster.status(), cluster.err());
        assertSameRuns(local, tmp.resolve("cluster"));
        assertEquals(96, lines(local), "4 replicates x 2 sizes x 3 samples x 4 configurations");
    }

    @Test
    @DisplayName("an executor JVM killed (SIGKILL) mid-study: its task is retried and the study ends as locally")
    void killedExecutorIsReplaced() throws Exception {
        Path study = study("large", 40, "[30, 40]", "[2000, 5000]");
        Path local = locally(study, "large-local");
        System.setProperty(SparkSettings.RUNS_PER_TASK, "8");
        Path out = tmp.resolve("large-cluster");
        CompletableFuture<SparkEngineTest.Result> cluster = CompletableFuture.supplyAsync(
                () -> run(study, out, "--engine", "spark", "--master", master));
        Optional<ProcessHandle> killed = Optional.empty();
        for (int i = 0; i < 1200 && killed.isEmpty() && !cluster.isDone(); i++) {
            if (lines(out) > 40) {
                killed = DAEMONS.get(1).descendants()
                        .filter(h -> h.info().commandLine().orElse("").contains("CoarseGrainedExecutorBackend"))
                        .findFirst();
                killed.ifPresent(ProcessHandle::destroyForcibly);
            }
            Thread.sleep(100);
        }
        SparkEngineTest.Result r = cluster.get(5, TimeUnit.MINUTES);
        System.clearProperty(SparkSettings.RUNS_PER_TASK);
        assertTrue(killed.isPresent(), "an executor was found and killed before the study ended");
        assertEquals(0, r.status(), r.err());
        assertSameRuns(local, out);
    }
}

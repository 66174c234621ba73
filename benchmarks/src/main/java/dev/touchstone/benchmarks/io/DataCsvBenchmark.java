package dev.touchstone.benchmarks.io;

import dev.touchstone.core.data.DataSet;
import dev.touchstone.core.random.Seeds;
import dev.touchstone.harness.io.DataCsv;

import org.apache.commons.rng.UniformRandomProvider;
import org.apache.commons.rng.sampling.distribution.ZigguratSampler;
import org.openjdk.jmh.annotations.Benchmark;
import org.openjdk.jmh.annotations.BenchmarkMode;
import org.openjdk.jmh.annotations.Fork;
import org.openjdk.jmh.annotations.Level;
import org.openjdk.jmh.annotations.Measurement;
import org.openjdk.jmh.annotations.Mode;
import org.openjdk.jmh.annotations.OutputTimeUnit;
import org.openjdk.jmh.annotations.Param;
import org.openjdk.jmh.annotations.Scope;
import org.openjdk.jmh.annotations.Setup;
import org.openjdk.jmh.annotations.State;
import org.openjdk.jmh.annotations.TearDown;
import org.openjdk.jmh.annotations.Warmup;

import java.io.IOException;
import java.io.InputStream;
import java.io.OutputStream;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.concurrent.TimeUnit;

/**
 * Reading and writing a data file of n × p Gaussian values (shortest decimals, about 19 bytes a
 * cell) through {@link DataCsv}, each against its floor in the same run: reading the file's
 * bytes through a 1 MiB buffer and touching each (for the reader), and copying the file's bytes
 * into a sink (for the writer, which formats into a sink of the same kind). MB/s = the file's
 * size / time. The reader and the writer use every core the JVM sees, so run it also with
 * {@code -jvmArgsAppend -XX:ActiveProcessorCount=1} for the figure per core.
 *
 * <p>Run: {@code java -jar benchmarks/target/benchmarks.jar -f 1 DataCsvBenchmark}.
 */
@State(Scope.Benchmark)
@BenchmarkMode(Mode.AverageTime)
@OutputTimeUnit(TimeUnit.MILLISECONDS)
@Warmup(iterations = 2, time = 2)
@Measurement(iterations = 5, time = 2)
@Fork(value = 1, jvmArgsAppend = {"-Xmx3g"})
public class DataCsvBenchmark {

    /** Rows × columns. */
    @Param({"200000x50", "1000x2000"})
    public String shape;

    private DataSet data;
    private Path file;
    private byte[] bytes;

    @Setup(Level.Trial)
    public void setUp() throws IOException {
        String[] parts = shape.split("x");
        int n = Integer.parseInt(parts[0]);
        int p = Integer.parseInt(parts[1]);
        UniformRandomProvider rng = Seeds.random(2222);
        ZigguratSampler.NormalizedGaussian normal = ZigguratSampler.NormalizedGaussian.of(rng);
        DataSet.Builder b = DataSet.builder(n);
        for (int j = 0; j < p; j++) {
            double[] col = new double[n];
            for (int r = 0; r < n; r++) {
                col[r] = 2 * normal.sample();
            }
            b.continuous("x" + j, col);
        }
        data = b.build();
        file = Files.createTempFile("touchstone-bench", ".csv");
        DataCsv.write(file, data);
        bytes = Files.readAllBytes(file);
    }

    @TearDown(Level.Trial)
    public void tearDown() throws IOException {
        Files.deleteIfExists(file);
    }

    @Benchmark
    public DataSet read() throws IOException {
        return DataCsv.read(file).data();
    }

    /** The reader's floor: the file's bytes through a 1 MiB buffer, each one touched. */
    @Benchmark
    public long readBytes() throws IOException {
        byte[] buf = new byte[1 << 20];
        long newlines = 0;
        try (InputStream in = Files.newInputStream(file)) {
            for (int r; (r = in.read(buf)) > 0; ) {
                for (int i = 0; i < r; i++) {
                    newlines += buf[i] == '\n' ? 1 : 0;
                }
            }
        }
        return newlines;
    }

    @Benchmark
    public long write() throws IOException {
        Sink sink = new Sink();
        DataCsv.write(sink, data);
        return sink.count;
    }

    /** The writer's floor: the same bytes, already formatted, handed to the sink in 1 MiB pieces. */
    @Benchmark
    public long copyBytes() throws IOException {
        Sink sink = new Sink();
        for (int at = 0; at < bytes.length; at += 1 << 20) {
            sink.write(bytes, at, Math.min(1 << 20, bytes.length - at));
        }
        return sink.count;
    }

    /** An output stream that keeps a checksum of what it is given, so nothing is optimised away. */
    private static final class Sink extends OutputStream {
        long count;

        @Override
        public void write(int b) {
            count += b;
        }

        @Override
        public void write(byte[] b, int off, int len) {
            long s = count;
            for (int i = off; i < off + len; i++) {
                s += b[i];
            }
            count = s;
        }
    }
}

package dev.touchstone.benchmarks.data;

import dev.touchstone.core.data.Covariances;
import dev.touchstone.core.data.DataSet;
import dev.touchstone.core.random.Seeds;

import org.apache.commons.rng.UniformRandomProvider;
import org.apache.commons.rng.sampling.distribution.ZigguratSampler;
import org.openjdk.jmh.annotations.Benchmark;
import org.openjdk.jmh.annotations.BenchmarkMode;
import org.openjdk.jmh.annotations.Fork;
import org.openjdk.jmh.annotations.Measurement;
import org.openjdk.jmh.annotations.Mode;
import org.openjdk.jmh.annotations.OutputTimeUnit;
import org.openjdk.jmh.annotations.Param;
import org.openjdk.jmh.annotations.Scope;
import org.openjdk.jmh.annotations.Setup;
import org.openjdk.jmh.annotations.State;
import org.openjdk.jmh.annotations.Warmup;

import java.util.concurrent.TimeUnit;

/**
 * The sample covariance of an n × p continuous data set: {@link Covariances#sample} with one
 * and two threads, against the naive upper-triangle k-i-j loop over the same centred
 * row-major data, and against summing every value once (the floor of reading the data).
 * Flops are counted as 2·n·p²/2 = n·p² (one multiply and one add for each row and each
 * entry of the upper triangle), so GFLOP/s = n·p² / time.
 *
 * <p>Run: {@code java -jar benchmarks/target/benchmarks.jar -f 1 CovarianceBenchmark}.
 */
@State(Scope.Benchmark)
@BenchmarkMode(Mode.AverageTime)
@OutputTimeUnit(TimeUnit.MILLISECONDS)
@Warmup(iterations = 3, time = 2)
@Measurement(iterations = 5, time = 2)
@Fork(value = 1, jvmArgsAppend = {"-Xmx6g"})
public class CovarianceBenchmark {

    /** Rows × columns. */
    @Param({"10000x1000", "2000x200"})
    public String shape;

    private DataSet data;

    @Setup
    public void setUp() {
        String[] parts = shape.split("x");
        int n = Integer.parseInt(parts[0]);
        int p = Integer.parseInt(parts[1]);
        UniformRandomProvider rng = Seeds.random(2026);
        ZigguratSampler.NormalizedGaussian normal = ZigguratSampler.NormalizedGaussian.of(rng);
        DataSet.Builder b = DataSet.builder(n);
        for (int j = 0; j < p; j++) {
            double[] col = new double[n];
            for (int r = 0; r < n; r++) {
                col[r] = 3 + normal.sample();
            }
            b.continuous("x" + j, col);
        }
        data = b.build();
    }

    @Benchmark
    public double[] tiledOneThread() {
        return Covariances.sample(data, 1).toArray();
    }

    @Benchmark
    public double[] tiledTwoThreads() {
        return Covariances.sample(data, 2).toArray();
    }

    /** The plain loop: centre into rows, then for each row add x_i·x_j into the upper triangle. */
    @Benchmark
    public double[] naiveUpperTriangle() {
        int n = data.rows();
        int p = data.columns();
        double[][] rows = new double[n][p];
        for (int j = 0; j < p; j++) {
            double[] col = data.continuous(j);
            double sum = 0;
            for (double v : col) {
                sum += v;
            }
            double mean = sum / n;
            for (int r = 0; r < n; r++) {
                rows[r][j] = col[r] - mean;
            }
        }
        double[] c = new double[p * p];
        for (int r = 0; r < n; r++) {
            double[] x = rows[r];
            for (int i = 0; i < p; i++) {
                double xi = x[i];
                int base = i * p;
                for (int j = i; j < p; j++) {
                    c[base + j] += xi * x[j];
                }
            }
        }
        for (int i = 0; i < p; i++) {
            for (int j = i; j < p; j++) {
                c[i * p + j] /= n - 1;
                c[j * p + i] = c[i * p + j];
            }
        }
        return c;
    }

    /** The floor: reading every value once. */
    @Benchmark
    public double sumEveryValue() {
        double s = 0;
        for (int j = 0; j < data.columns(); j++) {
            for (double v : data.continuous(j)) {
                s += v;
            }
        }
        return s;
    }
}

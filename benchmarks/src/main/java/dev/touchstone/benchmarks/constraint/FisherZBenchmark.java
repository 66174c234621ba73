package dev.touchstone.benchmarks.constraint;

import dev.touchstone.core.random.Seeds;
import dev.touchstone.learners.independence.FisherZTest;
import org.apache.commons.rng.UniformRandomProvider;
import org.openjdk.jmh.annotations.Benchmark;
import org.openjdk.jmh.annotations.BenchmarkMode;
import org.openjdk.jmh.annotations.Fork;
import org.openjdk.jmh.annotations.Measurement;
import org.openjdk.jmh.annotations.Mode;
import org.openjdk.jmh.annotations.OperationsPerInvocation;
import org.openjdk.jmh.annotations.OutputTimeUnit;
import org.openjdk.jmh.annotations.Param;
import org.openjdk.jmh.annotations.Scope;
import org.openjdk.jmh.annotations.Setup;
import org.openjdk.jmh.annotations.State;
import org.openjdk.jmh.annotations.Warmup;

import java.util.concurrent.TimeUnit;

/**
 * One Fisher z test on a cached correlation matrix (p = 200, n = 1,000), by conditioning
 * set size: the decision {@code independent} (PC's hot path), the full p-value, and as the
 * irreducible part the reads of the same matrix entries summed. Each invocation runs 1,024
 * tests over pre-drawn random (x, y, S) so that the loop, not the draw, is measured.
 */
@State(Scope.Thread)
@BenchmarkMode(Mode.Throughput)
@OutputTimeUnit(TimeUnit.MICROSECONDS)
@Warmup(iterations = 3, time = 1)
@Measurement(iterations = 5, time = 1)
@Fork(1)
public class FisherZBenchmark {

    private static final int BATCH = 1024;
    private static final int P = 200;

    @Param({"0", "1", "2", "3"})
    public int size;

    private FisherZTest test;
    private double[] matrix;
    private int[] xs;
    private int[] ys;
    private int[][] zs;

    @Setup
    public void setUp() {
        double[][] cols = SparseLinearData.columns(P, 1000, 2.0, 17);
        test = FisherZTest.of(SparseLinearData.dataSet(cols), 0.01);
        matrix = SparseLinearData.dataSet(cols).covariance().correlation().toArray();
        UniformRandomProvider rng = Seeds.random(18);
        xs = new int[BATCH];
        ys = new int[BATCH];
        zs = new int[BATCH][];
        for (int i = 0; i < BATCH; i++) {
            int[] perm = new int[size + 2];
            for (int k = 0; k < perm.length; k++) {
                int v;
                boolean fresh;
                do {
                    v = rng.nextInt(P);
                    fresh = true;
                    for (int q = 0; q < k; q++) {
                        fresh &= perm[q] != v;
                    }
                } while (!fresh);
                perm[k] = v;
            }
            xs[i] = perm[0];
            ys[i] = perm[1];
            zs[i] = java.util.Arrays.copyOfRange(perm, 2, perm.length);
        }
    }

    @Benchmark
    @OperationsPerInvocation(BATCH)
    public int decision() {
        int independent = 0;
        for (int i = 0; i < BATCH; i++) {
            if (test.independent(xs[i], ys[i], zs[i])) {
                independent++;
            }
        }
        return independent;
    }

    @Benchmark
    @OperationsPerInvocation(BATCH)
    public double pValue() {
        double s = 0;
        for (int i = 0; i < BATCH; i++) {
            s += test.pValue(xs[i], ys[i], zs[i]);
        }
        return s;
    }

    /** The irreducible part: reading the (|S| + 2)² matrix entries a test needs. */
    @Benchmark
    @OperationsPerInvocation(BATCH)
    public double readEntries() {
        double s = 0;
        for (int i = 0; i < BATCH; i++) {
            int[] z = zs[i];
            int x = xs[i];
            int y = ys[i];
            s += matrix[x * P + y];
            for (int a : z) {
                s += matrix[x * P + a] + matrix[y * P + a];
                for (int b : z) {
                    s += matrix[a * P + b];
                }
            }
        }
        return s;
    }
}

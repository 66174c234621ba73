package dev.touchstone.benchmarks.constraint;

import dev.touchstone.core.data.CentredColumns;
import dev.touchstone.core.data.DataSet;
import dev.touchstone.learners.independence.FisherZTest;
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
 * Level 0 of PC with Fisher z (α = 0.01, 2 threads) on linear Gaussian data with mean degree
 * 2, each invocation on a fresh data set over the same columns so that nothing is cached:
 * {@code fromColumns} screens every pair in tiles from the centred columns (no p × p matrix,
 * what PC uses above {@code FisherZTest.DENSE_LIMIT}); {@code matrix} builds the correlation
 * matrix and screens it (the path below the limit); {@code covarianceOnly}, the irreducible
 * part of both, builds the covariance alone (the same n·p²/2 multiply-adds). The fork has the
 * Vector API's module, so {@code fromColumns} runs the register-blocked Vector API tile kernel;
 * {@link LevelZeroBlockedLoopBenchmark} runs the same screen in a fork without it (the plain
 * blocked loop), so one JMH run compares the two kernels.
 */
@State(Scope.Benchmark)
@BenchmarkMode(Mode.SingleShotTime)
@OutputTimeUnit(TimeUnit.MILLISECONDS)
@Warmup(iterations = 2)
@Measurement(iterations = 5)
@Fork(value = 1, jvmArgs = {"-Xmx3g", "--add-modules", "jdk.incubator.vector"})
public class LevelZeroBenchmark {

    @Param({"2000"})
    public int p;

    @Param({"1000"})
    public int n;

    private double[][] columns;

    @Setup
    public void setUp() {
        columns = SparseLinearData.columns(p, n, 2.0, 29);
        // The fork runs with the Vector API's module, as the launcher does; fail rather than mislabel.
        if (!CentredColumns.tileKernel().startsWith("vector")) {
            throw new IllegalStateException("expected the Vector API tile kernel, got " + CentredColumns.tileKernel());
        }
    }

    @Benchmark
    public int[][] fromColumns() {
        return FisherZTest.fromColumns(SparseLinearData.dataSet(columns), 0.01).levelZero(2, () -> { });
    }

    @Benchmark
    public int[][] matrix() {
        return FisherZTest.of(SparseLinearData.dataSet(columns), 0.01).levelZero(2, () -> { });
    }

    @Benchmark
    public Object covarianceOnly() {
        DataSet d = SparseLinearData.dataSet(columns);
        return d.covariance();
    }
}

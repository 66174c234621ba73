package dev.touchstone.benchmarks.constraint;

import dev.touchstone.core.data.CentredColumns;
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
 * {@link LevelZeroBenchmark}'s {@code fromColumns} screen on the same data, in a fork without
 * the Vector API's module, so that level 0 runs on the plain blocked-loop tile kernel: run
 * together with {@code LevelZeroBenchmark}, one JMH run compares the two kernels on the same
 * multiply-adds (and both with {@code covarianceOnly}, the matrix path's cross product).
 */
@State(Scope.Benchmark)
@BenchmarkMode(Mode.SingleShotTime)
@OutputTimeUnit(TimeUnit.MILLISECONDS)
@Warmup(iterations = 2)
@Measurement(iterations = 5)
@Fork(value = 1, jvmArgs = {"-Xmx3g"})
public class LevelZeroBlockedLoopBenchmark {

    @Param({"2000"})
    public int p;

    @Param({"1000"})
    public int n;

    private double[][] columns;

    @Setup
    public void setUp() {
        columns = SparseLinearData.columns(p, n, 2.0, 29);
        if (!CentredColumns.tileKernel().equals("blocked-loop")) {
            throw new IllegalStateException("expected the blocked-loop tile kernel, got " + CentredColumns.tileKernel());
        }
    }

    @Benchmark
    public int[][] fromColumns() {
        return FisherZTest.fromColumns(SparseLinearData.dataSet(columns), 0.01).levelZero(2, () -> { });
    }
}

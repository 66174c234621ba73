package dev.touchstone.benchmarks.constraint;

import dev.touchstone.core.data.DataSet;
import dev.touchstone.core.knowledge.Knowledge;
import dev.touchstone.core.learner.Estimate;
import dev.touchstone.core.learner.LearnerInput;
import dev.touchstone.core.learner.RunContext;
import dev.touchstone.core.param.ParameterValues;
import dev.touchstone.learners.constraint.PcLearner;
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

import java.util.Map;
import java.util.concurrent.TimeUnit;

/**
 * A whole order-independent PC run (Fisher z, α = 0.01, 2 threads) on linear Gaussian data
 * with mean degree 2, covariance included (each invocation gets a fresh data set over the
 * same columns, so nothing is cached). The irreducible part, {@code covarianceOnly}, is
 * building the covariance alone. The number of tests of a run is printed once at setup.
 */
@State(Scope.Benchmark)
@BenchmarkMode(Mode.SingleShotTime)
@OutputTimeUnit(TimeUnit.MILLISECONDS)
@Warmup(iterations = 2)
@Measurement(iterations = 5)
@Fork(value = 1, jvmArgs = {"-Xmx3g"})
public class PcBenchmark {

    @Param({"1000"})
    public int p;

    @Param({"1000"})
    public int n;

    private double[][] columns;
    private final PcLearner pc = new PcLearner();
    private ParameterValues values;

    @Setup
    public void setUp() {
        columns = SparseLinearData.columns(p, n, 2.0, 23);
        values = ParameterValues.resolve("pc", pc.description().parameters(),
                Map.of("alpha", 0.01, "skeleton", "order-independent"));
        RunContext ctx = RunContext.of(1, null, 2);
        long t0 = System.nanoTime();
        Estimate e = pc.learn(LearnerInput.of(SparseLinearData.dataSet(columns)), Knowledge.none(), values, ctx);
        System.out.printf("%n[pc p=%d n=%d] tests=%d edges=%d first-run=%.0f ms%n", p, n, ctx.tests(),
                e.graph().edgeCount(), (System.nanoTime() - t0) / 1e6);
    }

    @Benchmark
    public Estimate orderIndependentPc() {
        return pc.learn(LearnerInput.of(SparseLinearData.dataSet(columns)), Knowledge.none(), values,
                RunContext.of(1, null, 2));
    }

    @Benchmark
    public Object covarianceOnly() {
        DataSet d = SparseLinearData.dataSet(columns);
        return d.covariance();
    }
}

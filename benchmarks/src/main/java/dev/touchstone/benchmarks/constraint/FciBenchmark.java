package dev.touchstone.benchmarks.constraint;

import dev.touchstone.core.knowledge.Knowledge;
import dev.touchstone.core.learner.Estimate;
import dev.touchstone.core.learner.LearnerInput;
import dev.touchstone.core.learner.RunContext;
import dev.touchstone.core.param.ParameterValues;
import dev.touchstone.learners.constraint.FciLearner;
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
 * A whole FCI run (Fisher z, α = 0.01, order-independent skeleton, 2 threads) on linear
 * Gaussian data with mean degree 2, covariance included, against PC on the same data: PC's
 * adjacency search is the part FCI shares, so the ratio is the cost of the Possible-D-Sep
 * step and the PAG rules. Tests per run are printed once at setup.
 */
@State(Scope.Benchmark)
@BenchmarkMode(Mode.SingleShotTime)
@OutputTimeUnit(TimeUnit.MILLISECONDS)
@Warmup(iterations = 3)
@Measurement(iterations = 9)
@Fork(value = 1, jvmArgs = {"-Xmx2g"})
public class FciBenchmark {

    @Param({"50"})
    public int p;

    @Param({"1000"})
    public int n;

    private double[][] columns;
    private final FciLearner fci = new FciLearner();
    private final PcLearner pc = new PcLearner();
    private ParameterValues fciValues;
    private ParameterValues pcValues;

    @Setup
    public void setUp() {
        columns = SparseLinearData.columns(p, n, 2.0, 29);
        Map<String, Object> raw = Map.of("alpha", 0.01, "skeleton", "order-independent");
        fciValues = ParameterValues.resolve("fci", fci.description().parameters(), raw);
        pcValues = ParameterValues.resolve("pc", pc.description().parameters(), raw);
        RunContext f = RunContext.of(1, null, 2);
        Estimate e = fci.learn(LearnerInput.of(SparseLinearData.dataSet(columns)), Knowledge.none(), fciValues, f);
        RunContext c = RunContext.of(1, null, 2);
        pc.learn(LearnerInput.of(SparseLinearData.dataSet(columns)), Knowledge.none(), pcValues, c);
        System.out.printf("%n[fci p=%d n=%d] fci tests=%d (pc %d) edges=%d possible-d-sep removed=%.0f%n", p, n,
                f.tests(), c.tests(), e.graph().edgeCount(), e.extras().get("possible_dsep_removed"));
    }

    @Benchmark
    public Estimate fci() {
        return fci.learn(LearnerInput.of(SparseLinearData.dataSet(columns)), Knowledge.none(), fciValues,
                RunContext.of(1, null, 2));
    }

    @Benchmark
    public Estimate pc() {
        return pc.learn(LearnerInput.of(SparseLinearData.dataSet(columns)), Knowledge.none(), pcValues,
                RunContext.of(1, null, 2));
    }
}

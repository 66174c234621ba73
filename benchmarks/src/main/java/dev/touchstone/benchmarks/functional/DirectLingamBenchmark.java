package dev.touchstone.benchmarks.functional;

import dev.touchstone.core.data.Covariances;
import dev.touchstone.core.data.DataSet;
import dev.touchstone.core.graph.Graph;
import dev.touchstone.core.knowledge.Knowledge;
import dev.touchstone.core.learner.LearnerInput;
import dev.touchstone.core.learner.RunContext;
import dev.touchstone.core.param.ParameterValues;
import dev.touchstone.generators.Simulation;
import dev.touchstone.generators.graphs.GraphFamilies;
import dev.touchstone.generators.models.ModelKinds;
import dev.touchstone.learners.functional.DirectLingamLearner;
import org.openjdk.jmh.annotations.Benchmark;
import org.openjdk.jmh.annotations.BenchmarkMode;
import org.openjdk.jmh.annotations.Fork;
import org.openjdk.jmh.annotations.Measurement;
import org.openjdk.jmh.annotations.Mode;
import org.openjdk.jmh.annotations.OutputTimeUnit;
import org.openjdk.jmh.annotations.Scope;
import org.openjdk.jmh.annotations.Setup;
import org.openjdk.jmh.annotations.State;
import org.openjdk.jmh.annotations.Warmup;

import java.util.Map;
import java.util.concurrent.TimeUnit;

/**
 * DirectLiNGAM on p = 50, n = 2,000 (uniform noise, Erdős–Rényi, mean degree 2), against
 * its irreducible part: one log cosh and one u·e^{−u²/2} per value for every residual the
 * order search evaluates (Σ_k k(k−1) residual columns of n values), summed and nothing else.
 */
@State(Scope.Benchmark)
@BenchmarkMode(Mode.AverageTime)
@OutputTimeUnit(TimeUnit.MILLISECONDS)
@Warmup(iterations = 2, time = 1)
@Measurement(iterations = 5, time = 1)
@Fork(value = 1, jvmArgsAppend = {"-Xms1g", "-Xmx1g"})
public class DirectLingamBenchmark {

    static final int VARIABLES = 50;
    static final int ROWS = 2_000;

    private DataSet data;
    private DirectLingamLearner learner;
    private ParameterValues parameters;
    private double[] column;

    @Setup
    public void setUp() {
        data = Simulation.builder()
                .graph(GraphFamilies.byId("erdos-renyi"), Map.of("nodes", VARIABLES, "mean_degree", 2))
                .model(ModelKinds.byId("linear-non-gaussian"), Map.of("noise", "uniform"))
                .build().drawTruth(1).sample(ROWS).data();
        learner = new DirectLingamLearner();
        parameters = ParameterValues.resolve(DirectLingamLearner.ID, learner.description().parameters(), Map.of());
        column = data.continuous(0).clone();
    }

    @Benchmark
    public Graph directLingam() {
        return learner.learn(LearnerInput.of(data), Knowledge.none(), parameters, RunContext.unlimited(1)).graph();
    }

    @Benchmark
    public Graph directLingamTwoThreads() {
        return learner.learn(LearnerInput.of(data), Knowledge.none(), parameters, RunContext.of(1, null, 2)).graph();
    }

    @Benchmark
    public double entropyTermsOnly() {
        long residuals = 0;
        for (int k = 2; k <= VARIABLES; k++) {
            residuals += (long) k * (k - 1);
        }
        double s = 0;
        for (long c = 0; c < residuals; c++) {
            for (double x : column) {
                double a = Math.abs(x);
                s += a + Math.log1p(Math.exp(-2 * a)) + x * Math.exp(-0.5 * x * x);
            }
        }
        return s;
    }

    @Benchmark
    public Object covarianceOnly() {
        return Covariances.sample(data);
    }
}

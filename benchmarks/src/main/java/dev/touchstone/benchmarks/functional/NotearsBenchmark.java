package dev.touchstone.benchmarks.functional;

import dev.touchstone.core.data.DataSet;
import dev.touchstone.core.graph.Graph;
import dev.touchstone.core.knowledge.Knowledge;
import dev.touchstone.core.learner.LearnerInput;
import dev.touchstone.core.learner.RunContext;
import dev.touchstone.core.param.ParameterValues;
import dev.touchstone.generators.Simulation;
import dev.touchstone.generators.graphs.GraphFamilies;
import dev.touchstone.generators.models.ModelKinds;
import dev.touchstone.learners.continuous.NotearsLearner;
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
 * Linear NOTEARS with default settings on p = 20 and 50 (linear Gaussian, equal noise
 * variances, Erdős–Rényi, mean degree 2, n = 1,000; the covariance is computed once in
 * setup since the learner's cost does not depend on n after it). Single-shot timing: one
 * run is seconds long. The estimate's {@code function_evaluations} extra gives the count
 * of Lagrangian evaluations (each one matrix exponential).
 */
@State(Scope.Benchmark)
@BenchmarkMode(Mode.SingleShotTime)
@OutputTimeUnit(TimeUnit.MILLISECONDS)
@Warmup(iterations = 1)
@Measurement(iterations = 3)
@Fork(value = 1, jvmArgsAppend = {"-Xms1g", "-Xmx1g"})
public class NotearsBenchmark {

    @Param({"20", "50"})
    public int variables;

    private DataSet data;
    private NotearsLearner learner;
    private ParameterValues parameters;

    @Setup
    public void setUp() {
        data = Simulation.builder()
                .graph(GraphFamilies.byId("erdos-renyi"), Map.of("nodes", variables, "mean_degree", 2))
                .model(ModelKinds.byId("linear-gaussian"), Map.of("noise_scale_low", 1.0, "noise_scale_high", 1.0))
                .build().drawTruth(1).sample(1_000).data();
        data.covariance();
        learner = new NotearsLearner();
        parameters = ParameterValues.resolve(NotearsLearner.ID, learner.description().parameters(), Map.of());
    }

    @Benchmark
    public Graph notears() {
        return learner.learn(LearnerInput.of(data), Knowledge.none(), parameters, RunContext.unlimited(1)).graph();
    }
}

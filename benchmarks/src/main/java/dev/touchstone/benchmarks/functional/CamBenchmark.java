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
import dev.touchstone.learners.functional.CamLearner;
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
 * CAM with default settings on p = 20, n = 1,000 (additive quadratic functions, Gaussian
 * noise, Erdős–Rényi, mean degree 2), against its near-irreducible part: the same learner with
 * one candidate parent per variable, which still builds every smoother and runs the whole
 * boosting neighbourhood selection but leaves the search almost nothing to do.
 */
@State(Scope.Benchmark)
@BenchmarkMode(Mode.AverageTime)
@OutputTimeUnit(TimeUnit.MILLISECONDS)
@Warmup(iterations = 2, time = 1)
@Measurement(iterations = 5, time = 1)
@Fork(value = 1, jvmArgsAppend = {"-Xms1g", "-Xmx1g"})
public class CamBenchmark {

    private DataSet data;
    private CamLearner learner;
    private ParameterValues defaults;
    private ParameterValues oneCandidate;

    @Setup
    public void setUp() {
        data = Simulation.builder()
                .graph(GraphFamilies.byId("erdos-renyi"), Map.of("nodes", 20, "mean_degree", 2))
                .model(ModelKinds.byId("additive-nonlinear"), Map.of("functions", "polynomial"))
                .build().drawTruth(1).sample(1_000).data();
        learner = new CamLearner();
        defaults = ParameterValues.resolve(CamLearner.ID, learner.description().parameters(), Map.of());
        oneCandidate = ParameterValues.resolve(CamLearner.ID, learner.description().parameters(),
                Map.of("candidate_parents", 1));
    }

    @Benchmark
    public Graph cam() {
        return learner.learn(LearnerInput.of(data), Knowledge.none(), defaults, RunContext.unlimited(1)).graph();
    }

    @Benchmark
    public Graph camOneCandidate() {
        return learner.learn(LearnerInput.of(data), Knowledge.none(), oneCandidate, RunContext.unlimited(1)).graph();
    }
}

package dev.touchstone.benchmarks.score;

import dev.touchstone.core.knowledge.Knowledge;
import dev.touchstone.core.learner.Learner;
import dev.touchstone.core.learner.LearnerInput;
import dev.touchstone.core.learner.RunContext;
import dev.touchstone.core.param.ParameterValues;
import dev.touchstone.learners.score.GesLearner;
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

import java.util.List;
import java.util.Map;
import java.util.concurrent.TimeUnit;

/**
 * GES at p = 200 (n = 500, mean degree 2) with and without knowledge, so that the cost of the
 * knowledge look-ups in the search's innermost loops shows: with {@code tiers} every variable
 * is in one of two tiers (the later half may not cause the earlier half), so every Insert and
 * Delete candidate asks the index. The same benchmark built on an earlier tree gives the
 * before figure of a change to the knowledge index; the floor is the {@code none} case.
 */
@State(Scope.Benchmark)
@BenchmarkMode(Mode.AverageTime)
@OutputTimeUnit(TimeUnit.MILLISECONDS)
@Warmup(iterations = 2, time = 2)
@Measurement(iterations = 5, time = 2)
@Fork(1)
public class GesKnowledgeBenchmark {

    @Param({"none", "tiers"})
    public String knowledge;

    private final Learner ges = new GesLearner();
    private LearnerInput input;
    private Knowledge k;
    private ParameterValues values;

    @Setup
    public void setUp() {
        LinearGaussianFixture f = LinearGaussianFixture.of(200, 2.0, 500, 20);
        input = LearnerInput.of(f.data);
        List<String> names = f.data.names();
        k = knowledge.equals("none") ? Knowledge.none()
                : Knowledge.builder().tier(names.subList(0, 100)).tier(names.subList(100, 200)).build();
        values = ParameterValues.resolve("learner ges", ges.description().parameters(), Map.of());
    }

    @Benchmark
    public Object ges() {
        return ges.learn(input, k, values, RunContext.unlimited(1)).graph();
    }
}

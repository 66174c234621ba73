package dev.touchstone.benchmarks.generators;

import dev.touchstone.core.data.DataSet;
import dev.touchstone.core.graph.Graph;
import dev.touchstone.core.random.Seeds;
import dev.touchstone.generators.graphs.GraphFamilies;
import dev.touchstone.generators.graphs.GraphFamily;
import dev.touchstone.generators.models.ModelKind;
import dev.touchstone.generators.models.ModelKinds;
import dev.touchstone.generators.models.StructuralModel;
import org.apache.commons.rng.UniformRandomProvider;
import org.apache.commons.rng.sampling.distribution.ZigguratSampler;
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
 * A linear Gaussian data set of n = 10⁶ rows over p = 100 variables (Erdős–Rényi, mean
 * degree 2) against its irreducible part: drawing the same 10⁸ standard normals with the
 * same sampler (Commons RNG ziggurat on L64_X128_MIX, one stream per variable), once into
 * arrays of the same shape and once only summed. Each data set is 800 MB, so the fork gets an 8 GB pre-touched heap with the parallel
 * collector: with G1 the 8 MB columns are humongous objects and timings scatter widely.
 */
@State(Scope.Benchmark)
@BenchmarkMode(Mode.AverageTime)
@OutputTimeUnit(TimeUnit.MILLISECONDS)
@Warmup(iterations = 2, time = 2)
@Measurement(iterations = 5, time = 2)
@Fork(value = 1, jvmArgsAppend = {"-Xms8g", "-Xmx8g", "-XX:+UseParallelGC", "-XX:+AlwaysPreTouch"})
public class LinearGaussianBenchmark {

    static final int ROWS = 1_000_000;
    static final int VARIABLES = 100;

    private StructuralModel model;

    @Setup
    public void setUp() {
        GraphFamily f = GraphFamilies.byId("erdos-renyi");
        Graph dag = f.generate(f.resolve(Map.of("nodes", VARIABLES, "mean_degree", 2)), Seeds.random(1)).dag();
        ModelKind k = ModelKinds.byId("linear-gaussian");
        model = k.draw(dag, k.resolve(Map.of()), Seeds.random(2));
    }

    @Benchmark
    public DataSet sampleLinearGaussian() {
        return model.sample(ROWS, 3);
    }

    @Benchmark
    public double[][] normalsIntoArrays() {
        double[][] out = new double[VARIABLES][];
        for (int v = 0; v < VARIABLES; v++) {
            UniformRandomProvider r = Seeds.random(Seeds.derive(3, "variable", v));
            ZigguratSampler.NormalizedGaussian g = ZigguratSampler.NormalizedGaussian.of(r);
            double[] x = new double[ROWS];
            for (int i = 0; i < ROWS; i++) {
                x[i] = g.sample();
            }
            out[v] = x;
        }
        return out;
    }

    @Benchmark
    public double normalsSummed() {
        double s = 0;
        for (int v = 0; v < VARIABLES; v++) {
            UniformRandomProvider r = Seeds.random(Seeds.derive(3, "variable", v));
            ZigguratSampler.NormalizedGaussian g = ZigguratSampler.NormalizedGaussian.of(r);
            for (int i = 0; i < ROWS; i++) {
                s += g.sample();
            }
        }
        return s;
    }
}

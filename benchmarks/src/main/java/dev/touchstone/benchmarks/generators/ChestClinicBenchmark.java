package dev.touchstone.benchmarks.generators;

import dev.touchstone.core.data.DataSet;
import dev.touchstone.generators.models.StructuralModel;
import dev.touchstone.generators.networks.ReferenceNetworks;
import org.apache.commons.rng.UniformRandomProvider;
import dev.touchstone.core.random.Seeds;
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

import java.util.concurrent.TimeUnit;

/**
 * 10⁶ rows of the chest-clinic network (8 binary variables) against its irreducible part:
 * the 8 · 10⁶ uniform draws, one stream per variable.
 */
@State(Scope.Benchmark)
@BenchmarkMode(Mode.AverageTime)
@OutputTimeUnit(TimeUnit.MILLISECONDS)
@Warmup(iterations = 3, time = 1)
@Measurement(iterations = 5, time = 1)
@Fork(value = 1, jvmArgsAppend = {"-Xms1g", "-Xmx1g"})
public class ChestClinicBenchmark {

    static final int ROWS = 1_000_000;

    private StructuralModel model;

    @Setup
    public void setUp() {
        model = ReferenceNetworks.chestClinic().model();
    }

    @Benchmark
    public DataSet sampleChestClinic() {
        return model.sample(ROWS, 3);
    }

    @Benchmark
    public double uniformsOnly() {
        double s = 0;
        for (int v = 0; v < 8; v++) {
            UniformRandomProvider r = Seeds.random(Seeds.derive(3, "variable", v));
            for (int i = 0; i < ROWS; i++) {
                s += r.nextDouble();
            }
        }
        return s;
    }
}

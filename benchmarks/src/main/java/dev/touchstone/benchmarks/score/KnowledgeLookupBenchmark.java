package dev.touchstone.benchmarks.score;

import dev.touchstone.core.knowledge.Knowledge;
import dev.touchstone.learners.knowledge.KnowledgeIndex;
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

import java.util.ArrayList;
import java.util.List;
import java.util.concurrent.TimeUnit;

/**
 * The question the score searches ask in their innermost loops, "is a → b forbidden?", over
 * all p² pairs at p = 200 with two tiers and a few explicit pairs: through the one
 * {@link KnowledgeIndex}, against its floor, a bare p × p boolean table read in the same loop
 * (the layout the score searches' own index had before there was one index).
 */
@State(Scope.Benchmark)
@BenchmarkMode(Mode.AverageTime)
@OutputTimeUnit(TimeUnit.MICROSECONDS)
@Warmup(iterations = 3, time = 1)
@Measurement(iterations = 5, time = 1)
@Fork(1)
public class KnowledgeLookupBenchmark {

    @Param({"200"})
    public int p;

    private KnowledgeIndex index;
    private boolean[] table;

    @Setup
    public void setUp() {
        List<String> names = new ArrayList<>();
        for (int i = 0; i < p; i++) {
            names.add("V" + i);
        }
        Knowledge k = Knowledge.builder().tier(names.subList(0, p / 2)).tier(names.subList(p / 2, p))
                .forbid("V0", "V1").forbid("V2", "V3").require("V4", "V5").build();
        index = KnowledgeIndex.of(k, names);
        table = new boolean[p * p];
        for (int a = 0; a < p; a++) {
            for (int b = 0; b < p; b++) {
                table[a * p + b] = a != b && k.isForbidden(names.get(a), names.get(b));
            }
        }
    }

    @Benchmark
    public int index() {
        int n = 0;
        for (int a = 0; a < p; a++) {
            for (int b = 0; b < p; b++) {
                n += index.isForbidden(a, b) ? 1 : 0;
            }
        }
        return n;
    }

    @Benchmark
    public int table() {
        int n = 0;
        for (int a = 0; a < p; a++) {
            for (int b = 0; b < p; b++) {
                n += table[a * p + b] ? 1 : 0;
            }
        }
        return n;
    }
}

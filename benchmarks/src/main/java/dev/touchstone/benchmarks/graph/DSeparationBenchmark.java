package dev.touchstone.benchmarks.graph;

import dev.touchstone.core.graph.Graph;
import dev.touchstone.core.graph.algorithms.DSeparation;
import dev.touchstone.core.random.Seeds;
import org.apache.commons.rng.UniformRandomProvider;
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
 * One d-separation query on a large DAG (mean degree 4), against one breadth-first search
 * over the whole graph from the same start, the irreducible part of a query that has to
 * look everywhere. Queries cycle through 1024 seeded (x, y, Z) with |Z| from 0 to 4; the
 * sample mode reports the median.
 */
@State(Scope.Thread)
@BenchmarkMode(Mode.SampleTime)
@OutputTimeUnit(TimeUnit.MICROSECONDS)
@Warmup(iterations = 3, time = 1)
@Measurement(iterations = 5, time = 1)
@Fork(1)
public class DSeparationBenchmark {

    @Param({"10000"})
    int nodes;

    private Graph dag;
    private DSeparation dsep;
    private int[] xs;
    private int[] ys;
    private int[][] zs;
    private int next;
    private int[] seen;
    private int[] queue;
    private int stamp;

    @Setup
    public void setUp() {
        dag = LargeDag.erdosRenyi(nodes, 4, 20261201L);
        dsep = new DSeparation(dag);
        UniformRandomProvider rng = Seeds.random(7L);
        xs = new int[1024];
        ys = new int[1024];
        zs = new int[1024][];
        for (int q = 0; q < xs.length; q++) {
            xs[q] = rng.nextInt(nodes);
            do {
                ys[q] = rng.nextInt(nodes);
            } while (ys[q] == xs[q]);
            zs[q] = new int[rng.nextInt(5)];
            for (int i = 0; i < zs[q].length; i++) {
                int z;
                do {
                    z = rng.nextInt(nodes);
                } while (z == xs[q] || z == ys[q]);
                zs[q][i] = z;
            }
        }
        seen = new int[nodes];
        queue = new int[nodes];
    }

    @Benchmark
    public boolean query() {
        int q = next++ & 1023;
        return dsep.separated(xs[q], ys[q], zs[q]);
    }

    @Benchmark
    public int breadthFirstBaseline() {
        int q = next++ & 1023;
        return LargeDag.breadthFirst(dag, xs[q], seen, ++stamp, queue);
    }
}

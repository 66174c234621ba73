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

import java.util.Arrays;
import java.util.concurrent.TimeUnit;

/**
 * One d-separation query on a large DAG (mean degree 4), against one breadth-first search
 * over the whole graph from the same start, the irreducible part of a query that has to
 * look everywhere. Queries cycle through 1024 seeded (x, y, Z):
 * <ul>
 *   <li>{@code query}: uniform x, y and |Z| from 0 to 4. On a sparse random DAG most such
 *       pairs are separated (ancestral sets are small: about e^4 ≈ 55 ancestors for the
 *       last variable in the order), so this is the typical oracle question of PC;</li>
 *   <li>{@code connectedQuery}: the same kind of query kept only when x and y are
 *       d-connected, so the ball has to travel until it meets y;</li>
 *   <li>{@code largeSetQuery}: |Z| = 200 uniform variables, which opens many colliders and
 *       makes the traversal (and the ancestor pass over Z) large.</li>
 * </ul>
 * The sample mode reports the median.
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
    private int[][] connected;
    private int[][] large;
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
        connected = new int[1024][];
        for (int q = 0; q < connected.length; ) {
            int[] query = randomQuery(rng, rng.nextInt(5));
            if (!dsep.separated(query[0], query[1], Arrays.copyOfRange(query, 2, query.length))) {
                connected[q++] = query;
            }
        }
        large = new int[1024][];
        for (int q = 0; q < large.length; q++) {
            large[q] = randomQuery(rng, 200);
        }
        seen = new int[nodes];
        queue = new int[nodes];
    }

    @Benchmark
    public boolean query() {
        int q = next++ & 1023;
        return dsep.separated(xs[q], ys[q], zs[q]);
    }

    /** x, y, then z distinct from both (z may repeat, which the query allows). */
    private int[] randomQuery(UniformRandomProvider rng, int zSize) {
        int[] out = new int[2 + zSize];
        out[0] = rng.nextInt(nodes);
        do {
            out[1] = rng.nextInt(nodes);
        } while (out[1] == out[0]);
        for (int i = 2; i < out.length; i++) {
            do {
                out[i] = rng.nextInt(nodes);
            } while (out[i] == out[0] || out[i] == out[1]);
        }
        return out;
    }

    @Benchmark
    public boolean connectedQuery() {
        int[] q = connected[next++ & 1023];
        return dsep.separated(q[0], q[1], Arrays.copyOfRange(q, 2, q.length));
    }

    @Benchmark
    public boolean largeSetQuery() {
        int[] q = large[next++ & 1023];
        return dsep.separated(q[0], q[1], Arrays.copyOfRange(q, 2, q.length));
    }

    @Benchmark
    public int breadthFirstBaseline() {
        int q = next++ & 1023;
        return LargeDag.breadthFirst(dag, xs[q], seen, ++stamp, queue);
    }
}

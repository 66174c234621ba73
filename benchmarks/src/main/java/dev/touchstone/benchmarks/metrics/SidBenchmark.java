package dev.touchstone.benchmarks.metrics;

import dev.touchstone.core.graph.Graph;
import dev.touchstone.core.graph.algorithms.Cpdags;
import dev.touchstone.core.graph.algorithms.DSeparation;
import dev.touchstone.metrics.sid.SidResult;
import dev.touchstone.metrics.sid.StructuralInterventionDistance;
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
 * The structural intervention distance between two independent random DAGs of mean degree 4 as p
 * grows, for a DAG estimate and for the CPDAG of the estimate (bounds), against the irreducible
 * part: p d-separation reachability passes (one per intervened node) with core's Bayes-ball.
 * Target: ≤ 2 s at p = 100.
 */
@State(Scope.Benchmark)
@BenchmarkMode(Mode.AverageTime)
@OutputTimeUnit(TimeUnit.MICROSECONDS)
@Warmup(iterations = 3, time = 1)
@Measurement(iterations = 5, time = 1)
@Fork(1)
public class SidBenchmark {

    @Param({"25", "50", "100", "200", "400", "800"})
    int p;

    Graph truth;
    Graph estimate;
    Graph estimateCpdag;
    DSeparation dsep;
    int[][] given;

    @Setup
    public void setup() {
        truth = SparseDags.dag(p, 4, 11);
        estimate = SparseDags.dag(p, 4, 12);
        estimateCpdag = Cpdags.of(estimate);
        dsep = new DSeparation(truth);
        given = new int[p][];
        for (int i = 0; i < p; i++) {
            int y = (i + 1) % p;
            given[i] = java.util.Arrays.stream(truth.parents(i)).filter(v -> v != y).toArray();
        }
    }

    @Benchmark
    public SidResult sidOfDag() {
        return StructuralInterventionDistance.between(truth, estimate);
    }

    @Benchmark
    public SidResult sidBoundsOfCpdag() {
        return StructuralInterventionDistance.between(truth, estimateCpdag);
    }

    /** Baseline: one reachability pass per node, what any per-intervention SID needs at least. */
    @Benchmark
    public int reachabilityPerNode() {
        int acc = 0;
        for (int i = 0; i < p; i++) {
            acc += dsep.separated(i, (i + 1) % p, given[i]) ? 1 : 0;
        }
        return acc;
    }
}

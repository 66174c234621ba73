package dev.touchstone.benchmarks.metrics;

import dev.touchstone.core.graph.Graph;
import dev.touchstone.core.graph.GraphClass;
import dev.touchstone.metrics.scoring.EdgeCounts;
import dev.touchstone.metrics.scoring.MetricRegistry;
import dev.touchstone.metrics.scoring.Scorer;
import dev.touchstone.metrics.scoring.StructuralMetric;
import dev.touchstone.metrics.truth.Truth;
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
import java.util.stream.Collectors;

/**
 * Every structural metric except the SID family (whose cost grows as p², see
 * {@link SidBenchmark}) on two independent sparse DAGs, against the irreducible part of the
 * work: one scan of both graphs' adjacency rows with their marks. Target: ≤ 200 ms at 100,000 nodes.
 */
@State(Scope.Benchmark)
@BenchmarkMode(Mode.AverageTime)
@OutputTimeUnit(TimeUnit.MILLISECONDS)
@Warmup(iterations = 3, time = 1)
@Measurement(iterations = 5, time = 1)
@Fork(1)
public class StructuralMetricsBenchmark {

    @Param({"100000"})
    int nodes;

    @Param({"4"})
    double meanDegree;

    Graph truth;
    Graph estimate;
    Truth t;
    List<String> metrics;

    @Setup
    public void setup() {
        truth = SparseDags.dag(nodes, meanDegree, 1);
        estimate = SparseDags.dag(nodes, meanDegree, 2);
        t = Truth.of(truth, GraphClass.DAG);
        metrics = MetricRegistry.structural().stream().map(StructuralMetric::name)
                .filter(n -> !n.startsWith("sid")).collect(Collectors.toList());
    }

    /** All structural metrics but the SID family: validation, counts, every ratio. */
    @Benchmark
    public Map<String, Double> allStructuralMetrics() {
        return Scorer.score(t, estimate, GraphClass.DAG, metrics);
    }

    /** The one-pass counts alone. */
    @Benchmark
    public EdgeCounts edgeCounts() {
        return EdgeCounts.of(truth, estimate);
    }

    /** Baseline: read every neighbour and both marks of every row of both graphs once. */
    @Benchmark
    public long scanBothGraphs() {
        long acc = 0;
        for (Graph g : new Graph[] {truth, estimate}) {
            for (int v = 0; v < g.size(); v++) {
                for (int k = 0, d = g.degree(v); k < d; k++) {
                    acc += g.neighbour(v, k) + g.markHere(v, k).ordinal() + g.markThere(v, k).ordinal();
                }
            }
        }
        return acc;
    }
}

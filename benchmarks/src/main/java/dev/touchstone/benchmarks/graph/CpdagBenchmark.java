package dev.touchstone.benchmarks.graph;

import dev.touchstone.core.graph.Graph;
import dev.touchstone.core.graph.algorithms.Ancestry;
import dev.touchstone.core.graph.algorithms.Cpdags;
import dev.touchstone.core.graph.algorithms.DagExtension;
import dev.touchstone.core.graph.algorithms.GraphChecks;
import dev.touchstone.core.graph.algorithms.MeekRules;
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
 * DAG → CPDAG on a large DAG (mean degree 4) by both constructions, with what any
 * construction must do at least: one topological sort (a traversal of the graph) and
 * building an output graph of the same size (copying the DAG into a new immutable graph).
 * Also the other whole-graph operations learners repeat: Meek's closure of the CPDAG (no
 * edge left to orient, so this is the worklist's scan), a consistent extension of the CPDAG
 * (Dor and Tarsi 1992), and the DAG check.
 */
@State(Scope.Benchmark)
@BenchmarkMode(Mode.SampleTime)
@OutputTimeUnit(TimeUnit.MILLISECONDS)
@Warmup(iterations = 5, time = 2)
@Measurement(iterations = 5, time = 1)
@Fork(1)
public class CpdagBenchmark {

    @Param({"10000"})
    int nodes;

    private Graph dag;
    private Graph cpdag;

    @Setup
    public void setUp() {
        dag = LargeDag.erdosRenyi(nodes, 4, 20261201L);
        cpdag = Cpdags.of(dag);
    }

    @Benchmark
    public Graph meek() {
        return Cpdags.meek(dag);
    }

    @Benchmark
    public Graph chickering() {
        return Cpdags.chickering(dag);
    }

    @Benchmark
    public int[] topologicalOrderBaseline() {
        return Ancestry.topologicalOrder(dag);
    }

    @Benchmark
    public Graph copyBaseline() {
        return dag.toMutable().freeze();
    }

    @Benchmark
    public Graph meekClosureOfCpdag() {
        return MeekRules.apply(cpdag);
    }

    @Benchmark
    public Graph extensionOfCpdag() {
        return DagExtension.of(cpdag);
    }

    @Benchmark
    public Graph checkDag() {
        GraphChecks.checkDag(dag);
        return dag;
    }
}

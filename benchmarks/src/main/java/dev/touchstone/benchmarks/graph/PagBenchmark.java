package dev.touchstone.benchmarks.graph;

import dev.touchstone.core.graph.Edge;
import dev.touchstone.core.graph.Graph;
import dev.touchstone.core.graph.Mark;
import dev.touchstone.core.graph.MutableGraph;
import dev.touchstone.core.graph.algorithms.Ancestry;
import dev.touchstone.core.graph.algorithms.LatentProjection;
import dev.touchstone.core.graph.algorithms.PagRules;
import dev.touchstone.core.graph.algorithms.Pags;
import dev.touchstone.core.graph.algorithms.SeparationInfo;
import dev.touchstone.core.random.Seeds;
import org.apache.commons.rng.UniformRandomProvider;
import org.openjdk.jmh.annotations.Benchmark;
import org.openjdk.jmh.annotations.BenchmarkMode;
import org.openjdk.jmh.annotations.Fork;
import org.openjdk.jmh.annotations.Level;
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
 * The cost of the true PAG ({@link Pags#of}) on random DAGs of a few hundred variables with
 * a tenth of them (confounders) hidden, split into its two stages: the latent projection
 * and the orientation rules on the MAG. The irreducible part it is compared with: one
 * ancestor set per observed variable, which any construction of the MAG's marks needs.
 */
@State(Scope.Benchmark)
@BenchmarkMode(Mode.AverageTime)
@OutputTimeUnit(TimeUnit.MILLISECONDS)
@Warmup(iterations = 3, time = 1)
@Measurement(iterations = 5, time = 1)
@Fork(1)
public class PagBenchmark {

    @Param({"100", "300"})
    public int nodes;

    @Param({"3"})
    public double meanDegree;

    private Graph dag;
    private Graph mag;
    private int[] observed;

    @Setup(Level.Trial)
    public void setUp() {
        dag = randomDagWithHiddenConfounders(nodes, meanDegree, nodes / 10, 20261201L);
        mag = LatentProjection.mag(dag);
        observed = dag.observedIndices();
    }

    @Benchmark
    public Graph pagOfDag() {
        return Pags.of(dag);
    }

    @Benchmark
    public Graph latentProjection() {
        return LatentProjection.mag(dag);
    }

    @Benchmark
    public Graph rulesOnMag() {
        MutableGraph pag = Graph.builder(mag.names());
        for (Edge e : mag.edges()) {
            pag.addEdge(e.a(), e.b(), Mark.CIRCLE, Mark.CIRCLE);
        }
        PagRules.withoutSelectionBias().orient(pag, SeparationInfo.fromMag(mag));
        return pag.freeze();
    }

    @Benchmark
    public int baselineAncestorSets() {
        int total = 0;
        for (int v : observed) {
            boolean[] an = Ancestry.ancestors(dag, v);
            total += an.length;
        }
        return total;
    }

    /** Erdős–Rényi DAG along a random order, then up to {@code hide} nodes with ≥ 2 children flagged hidden. */
    static Graph randomDagWithHiddenConfounders(int n, double meanDegree, int hide, long seed) {
        UniformRandomProvider rng = Seeds.random(seed);
        List<String> names = new ArrayList<>();
        for (int i = 1; i <= n; i++) {
            names.add("X" + i);
        }
        int[] order = new int[n];
        for (int i = 0; i < n; i++) {
            order[i] = i;
        }
        for (int i = n - 1; i > 0; i--) {
            int j = rng.nextInt(i + 1);
            int t = order[i];
            order[i] = order[j];
            order[j] = t;
        }
        double p = meanDegree / (n - 1);
        MutableGraph g = Graph.builder(names);
        for (int i = 0; i < n; i++) {
            for (int j = i + 1; j < n; j++) {
                if (rng.nextDouble() < p) {
                    g.addDirected(order[i], order[j]);
                }
            }
        }
        List<Integer> confounders = new ArrayList<>();
        for (int v = 0; v < n; v++) {
            if (g.children(v).length >= 2) {
                confounders.add(v);
            }
        }
        for (int k = 0; k < hide && !confounders.isEmpty(); k++) {
            g.setHidden(confounders.remove(rng.nextInt(confounders.size())), true);
        }
        return g.freeze();
    }
}

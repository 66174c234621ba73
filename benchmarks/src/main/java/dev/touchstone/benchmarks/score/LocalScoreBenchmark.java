package dev.touchstone.benchmarks.score;

import dev.touchstone.core.data.CovarianceMatrix;
import dev.touchstone.core.learner.RunContext;
import dev.touchstone.learners.score.BicScore;
import dev.touchstone.learners.score.LocalScore;
import dev.touchstone.learners.score.ScoreCache;
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
 * One BIC local score from a cached covariance (p = 200, n = 1,000) with 0 … 5 parents,
 * against its irreducible part: reading the (k + 1)² covariance entries it needs. Also the
 * cost of a hit in {@link ScoreCache} (for 0–2 parents the BIC bypasses the memo, so there
 * it measures the cache's front plus a direct computation). The parent sets cycle through
 * 64 fixed random sets so that the branch predictor does not see one set only.
 */
@State(Scope.Thread)
@BenchmarkMode(Mode.AverageTime)
@OutputTimeUnit(TimeUnit.NANOSECONDS)
@Warmup(iterations = 3, time = 1)
@Measurement(iterations = 5, time = 1)
@Fork(1)
public class LocalScoreBenchmark {

    @Param({"0", "1", "3", "5"})
    public int parents;

    private BicScore bic;
    private LocalScore cached;
    private double[] covariance;
    private int p;
    private int[][] sets;
    private int[] nodes;
    private int next;

    @Setup
    public void setUp() {
        LinearGaussianFixture f = LinearGaussianFixture.of(200, 2.0, 1000, 7);
        CovarianceMatrix c = f.data.covariance();
        bic = BicScore.of(c, 1.0);
        cached = ScoreCache.of(bic, RunContext.unlimited(1));
        covariance = c.toArray();
        p = c.dimension();
        java.util.Random r = new java.util.Random(3);
        sets = new int[64][parents];
        nodes = new int[64];
        for (int i = 0; i < 64; i++) {
            nodes[i] = r.nextInt(p);
            for (int k = 0; k < parents; k++) {
                int v;
                do {
                    v = r.nextInt(p);
                } while (v == nodes[i] || contains(sets[i], k, v));
                sets[i][k] = v;
            }
            cached.localScore(nodes[i], sets[i]);
        }
    }

    private static boolean contains(int[] a, int n, int v) {
        for (int i = 0; i < n; i++) {
            if (a[i] == v) {
                return true;
            }
        }
        return false;
    }

    @Benchmark
    public double bic() {
        int i = next++ & 63;
        return bic.localScore(nodes[i], sets[i]);
    }

    @Benchmark
    public double cacheHit() {
        int i = next++ & 63;
        return cached.localScore(nodes[i], sets[i]);
    }

    /** The irreducible part: touch every covariance entry the score reads. */
    @Benchmark
    public double gatherOnly() {
        int i = next++ & 63;
        int[] s = sets[i];
        int y = nodes[i];
        double acc = covariance[y * p + y];
        for (int a = 0; a < s.length; a++) {
            acc += covariance[s[a] * p + y];
            for (int b = 0; b <= a; b++) {
                acc += covariance[s[a] * p + s[b]];
            }
        }
        return acc;
    }
}

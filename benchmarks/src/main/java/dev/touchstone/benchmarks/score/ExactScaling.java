package dev.touchstone.benchmarks.score;

import dev.touchstone.core.graph.Graph;
import dev.touchstone.core.graph.algorithms.DagExtension;
import dev.touchstone.core.knowledge.Knowledge;
import dev.touchstone.core.learner.Estimate;
import dev.touchstone.core.learner.Learner;
import dev.touchstone.core.learner.LearnerInput;
import dev.touchstone.core.learner.RunContext;
import dev.touchstone.core.param.ParameterValues;
import dev.touchstone.learners.score.BicScore;
import dev.touchstone.learners.score.ExactScoreLearner;
import dev.touchstone.learners.score.GesLearner;
import dev.touchstone.learners.score.HillClimbLearner;
import dev.touchstone.learners.score.LocalScore;

import java.lang.management.ManagementFactory;
import java.lang.management.MemoryPoolMXBean;
import java.lang.management.MemoryType;
import java.util.Locale;
import java.util.Map;

/**
 * Measurements of the exact learner, two modes (run from the benchmarks jar, not a unit test):
 *
 * <ul>
 *   <li>{@code time LIMIT p1 p2 ...}: for each p, one run of the exact learner with this
 *       parent_limit (−1 for none) on linear Gaussian data (Erdős–Rényi, mean degree 2, 1,000
 *       rows, seeded), printing wall time, the thread's CPU time, the peak heap of the run
 *       (pools' peak after a reset; includes garbage not yet collected) and the
 *       local scores evaluated.</li>
 *   <li>{@code gap CASES ROWS}: on CASES seeded truths (p = 5 … 8 in turn, mean degree 3),
 *       BIC scores of GES, hill climbing (defaults) and the exact optimum on ROWS rows; prints
 *       one line per case and the counts of cases where each greedy learner reaches the
 *       optimum within 1e-6 relative.</li>
 *   <li>{@code variants CASES ROWS}: on CASES seeded truths (p = 5 … 8 in turn, mean degree 3
 *       and 4 in alternate blocks of four), how often plain GES, each GES variant (repeated
 *       phases, turning phase, both, 5 or 20 perturbed starts, all three) and hill climbing reach the exact
 *       BIC optimum within 1e-6 relative, and the median wall time of one run of each (one
 *       thread; the first eight cases are run once before, to warm the JIT, and not counted).</li>
 * </ul>
 */
public final class ExactScaling {

    private ExactScaling() {
    }

    public static void main(String[] args) {
        if (args[0].equals("time")) {
            time(Integer.parseInt(args[1]), java.util.Arrays.copyOfRange(args, 2, args.length));
        } else if (args[0].equals("variants")) {
            variants(Integer.parseInt(args[1]), Integer.parseInt(args[2]));
        } else {
            gap(Integer.parseInt(args[1]), Integer.parseInt(args[2]));
        }
    }

    private static Estimate run(Learner learner, LinearGaussianFixture f, Map<String, Object> raw, RunContext ctx) {
        ParameterValues values = ParameterValues.resolve(learner.description().id(), learner.description().parameters(), raw);
        return learner.learn(LearnerInput.of(f.data), Knowledge.none(), values, ctx);
    }

    private static void time(int limit, String[] sizes) {
        java.lang.management.ThreadMXBean mx = ManagementFactory.getThreadMXBean();
        System.out.println("p,parent_limit,seconds,thread_cpu_seconds,peak_heap_mb,local_scores,parent_sets_kept");
        for (String s : sizes) {
            int p = Integer.parseInt(s);
            LinearGaussianFixture f = LinearGaussianFixture.of(p, 2.0, 1000, 2000 + p);
            f.data.covariance();
            System.gc();
            for (MemoryPoolMXBean pool : ManagementFactory.getMemoryPoolMXBeans()) {
                pool.resetPeakUsage();
            }
            long c0 = mx.getCurrentThreadCpuTime();
            long t0 = System.nanoTime();
            Estimate e = run(new ExactScoreLearner(), f, Map.of("parent_limit", limit), RunContext.of(1, null, 1));
            long t1 = System.nanoTime();
            long c1 = mx.getCurrentThreadCpuTime();
            long peak = 0;
            for (MemoryPoolMXBean pool : ManagementFactory.getMemoryPoolMXBeans()) {
                if (pool.getType() == MemoryType.HEAP) {
                    peak += pool.getPeakUsage().getUsed();
                }
            }
            System.out.println(String.format(Locale.ROOT, "%d,%d,%.3f,%.3f,%.0f,%.0f,%.0f", p, limit, (t1 - t0) / 1e9,
                    (c1 - c0) / 1e9, peak / 1048576.0, e.extras().get("local-scores"), e.extras().get("parent-sets-kept")));
        }
    }

    private static void gap(int cases, int rows) {
        System.out.println("case,p,true_edges,exact_score,ges_score,hill_climbing_score,true_score,ges_at_optimum,hill_climbing_at_optimum");
        int gesHits = 0;
        int hcHits = 0;
        for (int c = 0; c < cases; c++) {
            int p = 5 + c % 4;
            LinearGaussianFixture f = LinearGaussianFixture.of(p, 3.0, rows, 50_000 + c);
            LocalScore bic = BicScore.of(f.data.covariance(), 1.0);
            double exact = run(new ExactScoreLearner(), f, Map.of("score", "bic"), RunContext.unlimited(c)).extras().get("score");
            double ges = dagScore(bic, DagExtension.of(run(new GesLearner(), f, Map.of("score", "bic"), RunContext.unlimited(c)).graph()));
            double hc = dagScore(bic, run(new HillClimbLearner(), f, Map.of("score", "bic"), RunContext.unlimited(c)).graph());
            boolean gesOk = ges >= exact - 1e-6 * Math.abs(exact);
            boolean hcOk = hc >= exact - 1e-6 * Math.abs(exact);
            gesHits += gesOk ? 1 : 0;
            hcHits += hcOk ? 1 : 0;
            System.out.println(String.format(Locale.ROOT, "%d,%d,%d,%.3f,%.3f,%.3f,%.3f,%b,%b", c, p, f.dag.edgeCount(), exact,
                    ges, hc, dagScore(bic, f.dag), gesOk, hcOk));
        }
        System.out.println(String.format(Locale.ROOT, "# %d cases, %d rows: GES at the optimum in %d, hill climbing in %d",
                cases, rows, gesHits, hcHits));
    }

    private static final String[] VARIANT_NAMES = {"ges", "ges repeated", "ges turning", "ges turning repeated",
        "ges 5 perturbed starts", "ges 20 perturbed starts", "ges all three", "hill climbing"};

    private static Map<String, Object> variantParameters(int i) {
        switch (i) {
            case 1: return Map.of("score", "bic", "repeat_phases", true);
            case 2: return Map.of("score", "bic", "turning_phase", true);
            case 3: return Map.of("score", "bic", "turning_phase", true, "repeat_phases", true);
            case 4: return Map.of("score", "bic", "perturbed_starts", 5);
            case 5: return Map.of("score", "bic", "perturbed_starts", 20);
            case 6: return Map.of("score", "bic", "turning_phase", true, "repeat_phases", true, "perturbed_starts", 5);
            default: return Map.of("score", "bic");
        }
    }

    private static void variants(int cases, int rows) {
        int k = VARIANT_NAMES.length;
        int warm = Math.min(8, cases);
        int[] hits = new int[k];
        int[][] byP = new int[k][4];
        double[][] seconds = new double[k + 1][cases];
        double[] worst = new double[k];
        System.out.println("case,p,mean_degree,true_edges,exact_score," + String.join(",", VARIANT_NAMES).replace(' ', '_'));
        for (int pass = 0; pass < 2; pass++) {
            int count = pass == 0 ? warm : cases;
            for (int c = 0; c < count; c++) {
                int p = 5 + c % 4;
                double degree = 3.0 + (c / 4) % 2;
                LinearGaussianFixture f = LinearGaussianFixture.of(p, degree, rows, 70_000 + c);
                LocalScore bic = BicScore.of(f.data.covariance(), 1.0);
                long t0 = System.nanoTime();
                double exact = run(new ExactScoreLearner(), f, Map.of("score", "bic"), RunContext.unlimited(c))
                        .extras().get("score");
                double exactSeconds = (System.nanoTime() - t0) / 1e9;
                StringBuilder line = new StringBuilder(String.format(Locale.ROOT, "%d,%d,%.0f,%d,%.3f", c, p, degree,
                        f.dag.edgeCount(), exact));
                for (int i = 0; i < k; i++) {
                    Learner learner = i == k - 1 ? new HillClimbLearner() : new GesLearner();
                    long s0 = System.nanoTime();
                    Graph g = run(learner, f, variantParameters(i), RunContext.unlimited(c)).graph();
                    double sec = (System.nanoTime() - s0) / 1e9;
                    double got = dagScore(bic, i == k - 1 ? g : DagExtension.of(g));
                    if (pass == 1) {
                        seconds[i][c] = sec;
                        boolean ok = got >= exact - 1e-6 * Math.abs(exact);
                        hits[i] += ok ? 1 : 0;
                        byP[i][p - 5] += ok ? 1 : 0;
                        worst[i] = Math.max(worst[i], exact - got);
                        line.append(String.format(Locale.ROOT, ",%.3f", got));
                    }
                }
                if (pass == 1) {
                    seconds[k][c] = exactSeconds;
                    System.out.println(line);
                }
            }
        }
        System.out.println(String.format(Locale.ROOT, "# %d cases, %d rows; learner, cases at the optimum, largest"
                + " shortfall, median ms, at the optimum for p = 5, 6, 7, 8", cases, rows));
        for (int i = 0; i < k; i++) {
            System.out.println(String.format(Locale.ROOT, "# %s, %d, %.2f, %.2f, %d %d %d %d", VARIANT_NAMES[i], hits[i],
                    worst[i], median(seconds[i]) * 1e3, byP[i][0], byP[i][1], byP[i][2], byP[i][3]));
        }
        System.out.println(String.format(Locale.ROOT, "# exact, %d, 0, %.2f", cases, median(seconds[k]) * 1e3));
    }

    private static double median(double[] values) {
        double[] v = values.clone();
        java.util.Arrays.sort(v);
        int n = v.length;
        return n % 2 == 1 ? v[n / 2] : (v[n / 2 - 1] + v[n / 2]) / 2;
    }

    private static double dagScore(LocalScore score, Graph dag) {
        double s = 0;
        for (int v = 0; v < dag.size(); v++) {
            s += score.localScore(v, dag.parents(v));
        }
        return s;
    }
}

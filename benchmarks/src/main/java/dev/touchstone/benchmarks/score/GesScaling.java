package dev.touchstone.benchmarks.score;

import dev.touchstone.core.graph.Graph;
import dev.touchstone.core.graph.algorithms.DagExtension;
import dev.touchstone.core.knowledge.Knowledge;
import dev.touchstone.core.learner.Estimate;
import dev.touchstone.core.learner.LearnerInput;
import dev.touchstone.core.learner.RunContext;
import dev.touchstone.core.param.ParameterValues;
import dev.touchstone.learners.score.BicScore;
import dev.touchstone.learners.score.EbicScore;
import dev.touchstone.learners.score.GesLearner;
import dev.touchstone.learners.score.LocalScore;

import java.util.Locale;
import java.util.Map;

/**
 * The scaling driver behind {@code scripts/scaling/score.sh}: runs GES on linear Gaussian
 * data (Erdős–Rényi, mean degree 2, n rows) for each p given and prints one line per p with
 * the wall time, the CPU time of the calling thread (robust to a loaded machine when
 * threads = 1), the time of the covariance (the irreducible part of the input work), the
 * number of local-score evaluations, the moves, the edge counts of estimate and truth, and
 * the run's score (BIC or extended BIC, with the run's penalty and gamma) of a DAG in the
 * estimated class and of the true DAG, so that over-fitting can be told from a search stuck
 * below the truth, and the peak resident memory so far. Usage: {@code GesScaling threads rows p1 p2 ...}; the system properties
 * {@code score} ({@code bic} or {@code ebic}, default bic), {@code penalty} (the BIC penalty
 * multiplier, default 1) and {@code gamma} (the extended BIC's, default 0.5) set the score.
 * {@code turning=true} adds GES's turning phase.
 * The CPU time of the whole process is printed too: on a
 * shared, loaded machine that time divided by the threads used is a floor for the wall time
 * the run would need on idle cores.
 */
public final class GesScaling {

    private GesScaling() {
    }

    public static void main(String[] args) {
        int threads = Integer.parseInt(args[0]);
        int rows = Integer.parseInt(args[1]);
        GesLearner ges = new GesLearner();
        String score = System.getProperty("score", "bic");
        double penalty = Double.parseDouble(System.getProperty("penalty", "1"));
        double gamma = Double.parseDouble(System.getProperty("gamma", "0.5"));
        ParameterValues values = ParameterValues.resolve("ges", ges.description().parameters(),
                Map.of("score", score, "penalty", penalty, "gamma", gamma,
                        "turning_phase", Boolean.getBoolean("turning")));
        java.lang.management.ThreadMXBean mx = java.lang.management.ManagementFactory.getThreadMXBean();
        com.sun.management.OperatingSystemMXBean os = (com.sun.management.OperatingSystemMXBean)
                java.lang.management.ManagementFactory.getOperatingSystemMXBean();
        System.out.println("p,rows,threads,score,penalty,gamma,seconds,process_cpu_seconds,main_thread_cpu_seconds,covariance_seconds,score_evaluations,forward_moves,backward_moves,edges,true_edges,estimate_score,true_score,peak_rss_mb");
        for (int a = 2; a < args.length; a++) {
            int p = Integer.parseInt(args[a]);
            LinearGaussianFixture f = LinearGaussianFixture.of(p, 2.0, rows, 1000 + p);
            long c0 = mx.getCurrentThreadCpuTime();
            long pc0 = os.getProcessCpuTime();
            long t0 = System.nanoTime();
            f.data.covariance();
            long t1 = System.nanoTime();
            RunContext ctx = RunContext.of(1, null, threads);
            Estimate e = ges.learn(LearnerInput.of(f.data), Knowledge.none(), values, ctx);
            long t2 = System.nanoTime();
            long c2 = mx.getCurrentThreadCpuTime();
            long pc2 = os.getProcessCpuTime();
            BicScore bic = BicScore.of(f.data.covariance(), penalty);
            LocalScore local = score.equals("ebic") ? EbicScore.of(bic, gamma) : bic;
            System.out.println(String.format(Locale.ROOT, "%d,%d,%d,%s,%.2f,%.2f,%.3f,%.3f,%.3f,%.3f,%d,%.0f,%.0f,%d,%d,%.1f,%.1f,%d", p,
                    rows, threads, score, penalty, score.equals("ebic") ? gamma : 0.0, (t2 - t0) / 1e9, (pc2 - pc0) / 1e9, (c2 - c0) / 1e9, (t1 - t0) / 1e9, ctx.scores(),
                    e.extras().get("forward-moves"), e.extras().get("backward-moves"), e.graph().edgeCount(),
                    f.dag.edgeCount(), dagScore(local, DagExtension.of(e.graph())), dagScore(local, f.dag), peakRssMegabytes()));
        }
    }

    /**
     * The process's peak resident memory so far (VmHWM of /proc/self/status, Linux), in MB, or
     * −1 where that file is missing; with several p in one run it is the peak up to this p.
     */
    private static long peakRssMegabytes() {
        try {
            for (String line : java.nio.file.Files.readAllLines(java.nio.file.Path.of("/proc/self/status"))) {
                if (line.startsWith("VmHWM:")) {
                    return Long.parseLong(line.replaceAll("[^0-9]", "")) / 1024;
                }
            }
        } catch (java.io.IOException | RuntimeException e) {
            return -1;
        }
        return -1;
    }

    /** The decomposable score of a DAG: the sum of its nodes' local scores given their parents. */
    private static double dagScore(LocalScore score, Graph dag) {
        double s = 0;
        for (int v = 0; v < dag.size(); v++) {
            s += score.localScore(v, dag.parents(v));
        }
        return s;
    }
}

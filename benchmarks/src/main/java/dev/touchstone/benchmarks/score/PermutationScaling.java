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
import dev.touchstone.learners.score.BossLearner;
import dev.touchstone.learners.score.EbicScore;
import dev.touchstone.learners.score.GesLearner;
import dev.touchstone.learners.score.LocalScore;

import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import java.util.Map;

/**
 * The scaling driver behind {@code scripts/scaling/permutation.sh}: for each p given, draws one
 * linear Gaussian data set (Erdős–Rényi of the given mean degree, n rows; {@link LinearGaussianFixture})
 * and runs each learner named in the system property {@code learners} (comma-separated ids among
 * {@code boss} and {@code ges}, default both, in that order) on the same data. One CSV line per run:
 * wall time, process CPU time, local-score evaluations, edges of estimate and truth, adjacency
 * precision and recall against the true DAG, and the run's score (BIC or EBIC) of a DAG in the
 * estimated class and of the true DAG, then the learner's own counts. Usage: {@code PermutationScaling threads rows meanDegree p1 p2 ...};
 * properties {@code score} (bic or ebic, default bic), {@code penalty} (default 1), {@code gamma}
 * (default 0.5); for BOSS {@code backward} (its backward_phase, default true) and {@code starts} (default 1).
 */
public final class PermutationScaling {

    private PermutationScaling() {
    }

    public static void main(String[] args) {
        int threads = Integer.parseInt(args[0]);
        int rows = Integer.parseInt(args[1]);
        double degree = Double.parseDouble(args[2]);
        String score = System.getProperty("score", "bic");
        double penalty = Double.parseDouble(System.getProperty("penalty", "1"));
        double gamma = Double.parseDouble(System.getProperty("gamma", "0.5"));
        List<Learner> learners = new ArrayList<>();
        for (String id : System.getProperty("learners", "boss,ges").split(",")) {
            learners.add(id.equals(BossLearner.ID) ? new BossLearner() : new GesLearner());
        }
        com.sun.management.OperatingSystemMXBean os = (com.sun.management.OperatingSystemMXBean)
                java.lang.management.ManagementFactory.getOperatingSystemMXBean();
        System.out.println("learner,p,rows,mean_degree,threads,score,penalty,seconds,process_cpu_seconds,score_evaluations,"
                + "edges,true_edges,adjacency_precision,adjacency_recall,estimate_score,true_score,extras");
        for (int a = 3; a < args.length; a++) {
            int p = Integer.parseInt(args[a]);
            LinearGaussianFixture f = LinearGaussianFixture.of(p, degree, rows, 1000 + p);
            f.data.covariance();
            BicScore bic = BicScore.of(f.data.covariance(), penalty);
            LocalScore local = score.equals("ebic") ? EbicScore.of(bic, gamma) : bic;
            for (Learner learner : learners) {
                Map<String, Object> raw = new java.util.HashMap<>(Map.of("score", score, "penalty", penalty, "gamma", gamma));
                if (learner instanceof BossLearner) {
                    raw.put("backward_phase", Boolean.parseBoolean(System.getProperty("backward", "true")));
                    raw.put("starts", Integer.parseInt(System.getProperty("starts", "1")));
                }
                ParameterValues values = ParameterValues.resolve(learner.description().id(),
                        learner.description().parameters(), raw);
                long pc0 = os.getProcessCpuTime();
                long t0 = System.nanoTime();
                RunContext ctx = RunContext.of(1, null, threads);
                Estimate e = learner.learn(LearnerInput.of(f.data), Knowledge.none(), values, ctx);
                long t1 = System.nanoTime();
                long pc1 = os.getProcessCpuTime();
                int tp = 0;
                for (var edge : e.graph().edges()) {
                    tp += f.dag.adjacent(edge.a(), edge.b()) ? 1 : 0;
                }
                int est = e.graph().edgeCount();
                int truth = f.dag.edgeCount();
                System.out.println(String.format(Locale.ROOT, "%s,%d,%d,%.1f,%d,%s,%.2f,%.3f,%.3f,%d,%d,%d,%.3f,%.3f,%.1f,%.1f,%s",
                        learner.description().id(), p, rows, degree, threads, score, penalty, (t1 - t0) / 1e9,
                        (pc1 - pc0) / 1e9, ctx.scores(), est, truth, est == 0 ? 1.0 : tp / (double) est,
                        truth == 0 ? 1.0 : tp / (double) truth, dagScore(local, DagExtension.of(e.graph())),
                        dagScore(local, f.dag), extras(e)));
            }
        }
    }

    /** The learner's own counts, as name=value pairs separated by semicolons (sorted by name). */
    private static String extras(Estimate e) {
        StringBuilder b = new StringBuilder();
        new java.util.TreeMap<>(e.extras()).forEach((k, v) -> b.append(b.length() == 0 ? "" : ";").append(k).append('=')
                .append(String.format(Locale.ROOT, "%.0f", v)));
        return b.toString();
    }

    private static double dagScore(LocalScore score, Graph dag) {
        double s = 0;
        for (int v = 0; v < dag.size(); v++) {
            s += score.localScore(v, dag.parents(v));
        }
        return s;
    }
}

package dev.touchstone.benchmarks.constraint;

import dev.touchstone.core.data.DataSet;
import dev.touchstone.core.learner.DeadlineExceededException;
import dev.touchstone.core.knowledge.Knowledge;
import dev.touchstone.core.learner.Estimate;
import dev.touchstone.core.learner.Learner;
import dev.touchstone.core.learner.LearnerInput;
import dev.touchstone.core.learner.RunContext;
import dev.touchstone.core.param.ParameterValues;
import dev.touchstone.learners.constraint.FciLearner;
import dev.touchstone.learners.constraint.RfciLearner;
import dev.touchstone.learners.hybrid.GfciLearner;

import java.time.Duration;
import java.util.Arrays;
import java.util.HashMap;
import java.util.Locale;
import java.util.Map;
import java.util.TreeMap;

/**
 * The scaling driver behind {@code scripts/scaling/constraint.sh hidden}: the PAG learners on data
 * with hidden variables, one single-shot run each on the same data, so RFCI's saving over FCI
 * (Colombo, Maathuis, Kalisch and Richardson 2012: no Possible-D-Sep step) and GFCI's cost
 * (Ogarrio, Spirtes and Ramsey 2016: GES, then FCI's tests on GES's adjacencies) are measured
 * side by side. The truth is {@link SparseLinearData}'s DAG over p variables (mean degree 2 or the
 * system property {@code degree}, weights
 * ±[0.5, 1.5]); every k-th variable from the first on (X1, X1+k, …) is hidden, i.e. its column is
 * dropped, so the learners see about p − p/k of them; the earlier variables of that DAG have more
 * children, so the hidden ones include confounders. One CSV line per run: wall and process CPU
 * seconds, independence tests, score evaluations, edges, then the learner's own counts.
 * Usage: {@code HiddenScaling threads rows hiddenEvery p learner1,learner2,…} (learners among
 * {@code fci}, {@code rfci}, {@code gfci}); Fisher z (and for GFCI the BIC) with α = 0.01. A run still going after
 * the minutes of the system property {@code minutes} (default 30) is stopped and reported as such.
 */
public final class HiddenScaling {

    private HiddenScaling() {
    }

    public static void main(String[] args) {
        int threads = Integer.parseInt(args[0]);
        int rows = Integer.parseInt(args[1]);
        int every = Integer.parseInt(args[2]);
        int p = Integer.parseInt(args[3]);
        String[] ids = args[4].split(",");
        long minutes = Long.getLong("minutes", 30);
        double degree = Double.parseDouble(System.getProperty("degree", "2"));
        double[][] all = SparseLinearData.columns(p, rows, degree, 41L + p);
        double[][] observed = Arrays.stream(java.util.stream.IntStream.range(0, p).filter(j -> j % every != 0)
                .toArray()).mapToObj(j -> all[j]).toArray(double[][]::new);
        com.sun.management.OperatingSystemMXBean os = (com.sun.management.OperatingSystemMXBean)
                java.lang.management.ManagementFactory.getOperatingSystemMXBean();
        System.out.println("learner,p,observed,hidden,rows,threads,seconds,process_cpu_seconds,tests,score_evaluations,edges,extras");
        for (String id : ids) {
            Learner learner = switch (id) {
                case "fci" -> new FciLearner();
                case "rfci" -> new RfciLearner();
                case "gfci" -> new GfciLearner();
                default -> throw new IllegalArgumentException("unknown learner " + id + " (fci, rfci, gfci)");
            };
            Map<String, Object> raw = new HashMap<>(Map.of("alpha", 0.01));
            ParameterValues values = ParameterValues.resolve(id, learner.description().parameters(), raw);
            DataSet data = SparseLinearData.dataSet(observed);
            long cpu0 = os.getProcessCpuTime();
            long t0 = System.nanoTime();
            RunContext ctx = RunContext.of(1, Duration.ofMinutes(minutes), threads);
            Estimate e;
            try {
                e = learner.learn(LearnerInput.of(data), Knowledge.none(), values, ctx);
            } catch (DeadlineExceededException stopped) {
                System.out.println(String.format(Locale.ROOT, "%s,%d,%d,%d,%d,%d,stopped after %d minutes,,%d,%d,,",
                        id, p, observed.length, p - observed.length, rows, threads, minutes, ctx.tests(), ctx.scores()));
                continue;
            }
            long t1 = System.nanoTime();
            long cpu1 = os.getProcessCpuTime();
            StringBuilder extras = new StringBuilder();
            new TreeMap<>(e.extras()).forEach((k, v) -> extras.append(extras.length() == 0 ? "" : ";").append(k)
                    .append('=').append(String.format(Locale.ROOT, "%.0f", v)));
            System.out.println(String.format(Locale.ROOT, "%s,%d,%d,%d,%d,%d,%.3f,%.3f,%d,%d,%d,%s", id, p,
                    observed.length, p - observed.length, rows, threads, (t1 - t0) / 1e9, (cpu1 - cpu0) / 1e9,
                    ctx.tests(), ctx.scores(), e.graph().edgeCount(), extras));
        }
    }
}

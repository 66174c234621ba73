package dev.touchstone.harness.cli;

import dev.touchstone.harness.execution.GeneratorSimulator;
import dev.touchstone.harness.execution.MetricsScorer;
import dev.touchstone.harness.execution.PilotEstimate;
import dev.touchstone.harness.execution.StudyRunner;
import dev.touchstone.harness.study.LearnerConfig;
import dev.touchstone.harness.study.GeneratorTruthCatalog;
import dev.touchstone.harness.study.Plan;
import dev.touchstone.harness.study.SampleSize;
import dev.touchstone.harness.study.TruthSetting;
import picocli.CommandLine.Command;
import picocli.CommandLine.Mixin;
import picocli.CommandLine.Option;
import picocli.CommandLine.Parameters;

import java.io.PrintWriter;
import java.nio.file.Path;
import java.time.Duration;
import java.util.Locale;
import java.util.concurrent.Callable;

/**
 * {@code touchstone check STUDY}: validates a study (printing every problem, one line each)
 * and prints its grid, the work it implies and an estimate of its wall time from a short pilot
 * ({@link PilotEstimate}), without running the study.
 */
@Command(name = "check", description = "Validate a study (every problem is listed, one line each); print its grid"
        + " size, settings, the work it implies and its estimated wall time, measured by a short pilot: one run per"
        + " learner configuration and setting, on replicate 0, each with a time limit so that the pilot's runs take"
        + " at most --pilot-seconds in all.")
final class CheckCommand implements Callable<Integer> {

    @Option(names = "--no-pilot", description = "Run no pilot: say only the worst case the time limit allows.")
    boolean noPilot;

    @Option(names = "--pilot-seconds", paramLabel = "S", description = "What the pilot's runs may take in all"
            + " (default: ${DEFAULT-VALUE}); each gets S divided by their number as its time limit.")
    double pilotSeconds = 30;

    @Mixin
    ThreadsOption threads;

    @Parameters(paramLabel = "STUDY", description = "The study file (YAML or JSON).")
    Path study;

    @Mixin
    LearnerSourceOptions sources;

    @picocli.CommandLine.Spec
    picocli.CommandLine.Model.CommandSpec spec;

    @Override
    public Integer call() {
        PrintWriter out = spec.commandLine().getOut();
        Toolkit kit = sources.toolkit();
        Plan plan = kit.plan(kit.readStudy(study));
        var s = plan.study();
        out.printf(Locale.ROOT, "study %s: valid%n", s.name());
        out.printf(Locale.ROOT, "  %,d truth settings x %,d sample sizes = %,d settings; %,d replicates each%n",
                plan.truths().size(), s.samples().size(), plan.settingCount(), s.replicates());
        out.printf(Locale.ROOT, "  %,d learner configurations; %,d runs in all (limit %,d)%n", plan.configs().size(),
                plan.runs().size(), s.limits().maxRuns());
        out.println("truth settings:");
        for (TruthSetting t : plan.truths()) {
            out.println("  " + t.label());
        }
        StringBuilder samples = new StringBuilder();
        for (SampleSize n : s.samples()) {
            samples.append(samples.length() == 0 ? "" : ", ").append(n.word());
        }
        out.println("sample sizes: " + samples);
        out.println("learner configurations:");
        for (LearnerConfig c : plan.configs()) {
            out.println("  " + c.label() + " (" + c.use() + ": " + c.parametersText() + ")");
        }
        long cells = 0;
        int rows = StudyRunner.largestRows(plan);
        for (TruthSetting t : plan.truths()) {
            long p = GeneratorTruthCatalog.simulation(t).drawTruth(0L).dag().observedIndices().length;
            cells += p * rows * (long) s.replicates();
        }
        out.printf(Locale.ROOT, "work: %,d replicates to draw (%,d rows each, about %,d data cells in all);"
                + " %,d learner runs%n", plan.replicateCount(), rows, cells, plan.runs().size());
        if (!noPilot) {
            if (!(pilotSeconds > 0) || pilotSeconds > 3600) {
                throw new UsageException("--pilot-seconds must be more than 0 and at most 3600, got " + pilotSeconds);
            }
            PilotEstimate.Figures f = PilotEstimate.of(plan, new GeneratorSimulator(), new MetricsScorer(),
                    threads.value(), Duration.ofMillis(Math.round(pilotSeconds * 1000)));
            PilotEstimate.describe(f).forEach(out::println);
        } else if (s.limits().perRun() != null) {
            double worst = plan.runs().size() * s.limits().seconds();
            out.printf(Locale.ROOT, "  time limit %s s per run: at most %.0f core-seconds of learner time%n",
                    dev.touchstone.harness.study.Canonical.value(s.limits().seconds()), worst);
        } else {
            out.println("  no time limit per run (set limits.seconds to bound the work)");
        }
        out.println("study hash: " + plan.hash());
        out.flush();
        return Main.DONE;
    }
}

package dev.touchstone.harness.cli;

import dev.touchstone.harness.catalog.LearnerCatalog;
import dev.touchstone.harness.execution.GeneratorSimulator;
import dev.touchstone.harness.execution.Journal;
import dev.touchstone.harness.execution.LocalExecutor;
import dev.touchstone.harness.execution.MetricsAggregator;
import dev.touchstone.harness.execution.MetricsScorer;
import dev.touchstone.harness.execution.Progress;
import dev.touchstone.harness.execution.StudyRunner;
import dev.touchstone.harness.outside.CommandLearner;
import dev.touchstone.harness.outside.CommandSpec;
import dev.touchstone.harness.outside.LearnersFile;
import dev.touchstone.harness.outside.PluginLoader;
import dev.touchstone.harness.study.Expansion;
import dev.touchstone.harness.study.GeneratorTruthCatalog;
import dev.touchstone.harness.study.MetricCatalog;
import dev.touchstone.harness.study.Plan;
import dev.touchstone.harness.study.RegistryMetricCatalog;
import dev.touchstone.harness.study.Study;
import dev.touchstone.harness.study.StudyException;
import dev.touchstone.harness.study.StudyReader;
import dev.touchstone.harness.study.TruthCatalog;

import java.io.PrintWriter;
import java.nio.file.Path;
import java.util.HashMap;
import java.util.List;
import java.util.Map;

/**
 * Wires the command line to the real parts: learner catalogue (built in, plug-ins from
 * {@code --plugins}, commands from {@code --learners}), the truth and metric catalogues,
 * the simulator, scorer and aggregator.
 */
final class Toolkit {

    final LearnerCatalog learners;
    final TruthCatalog truth = new GeneratorTruthCatalog();
    final MetricCatalog metrics = new RegistryMetricCatalog();
    private final Map<String, String> fingerprints = new HashMap<>();

    Toolkit(Path learnersFile, Path pluginDir) {
        LearnerCatalog.Builder b = LearnerCatalog.builder()
                .addServices(Toolkit.class.getClassLoader(), LearnerCatalog.Origin.BUILT_IN, "built in");
        try {
            if (pluginDir != null) {
                PluginLoader.addPlugins(b, pluginDir);
            }
            if (learnersFile != null) {
                List<CommandSpec> specs = LearnersFile.read(learnersFile);
                for (CommandSpec s : specs) {
                    b.addCommand(new CommandLearner(s), learnersFile.toString());
                    fingerprints.put(s.description().id(), s.fingerprint());
                }
            }
        } catch (StudyException e) {
            throw new UsageException(e.getMessage(), e);
        } catch (IllegalArgumentException e) {
            throw new UsageException(e.getMessage(), e);
        }
        this.learners = b.build();
    }

    Study readStudy(Path file) {
        try {
            return new StudyReader(truth, learners, metrics).read(file);
        } catch (StudyException e) {
            throw new UsageException(e.getMessage(), e);
        }
    }

    Plan plan(Study study) {
        try {
            return new Expansion(truth, id -> fingerprints.getOrDefault(id, "")).expand(study, learners);
        } catch (StudyException e) {
            throw new UsageException(e.getMessage(), e);
        }
    }

    /** Writes report.html and report.md for the study in {@code out} (finished or partial) into {@code to}. */
    Path report(Plan plan, Path out, Path to) {
        return dev.touchstone.harness.report.StudyReports.write(to, reportData(plan, out));
    }

    /** The report data of the study in {@code out}, from its journal. */
    dev.touchstone.reports.ReportData reportData(Plan plan, Path out) {
        return dev.touchstone.harness.report.ReportFolder.read(out, plan, new GeneratorSimulator(),
                new MetricsAggregator());
    }

    StudyRunner runner() {
        return new StudyRunner(new GeneratorSimulator(), new MetricsScorer(), new MetricsAggregator());
    }

    /**
     * Runs (or resumes) a plan into {@code folder} with {@code threads} workers (null: all
     * cores), showing progress on {@code err} unless {@code quiet}: live on a terminal,
     * plain periodic lines otherwise. Bad thread counts and unusable folders or journals are
     * bad input (exit 2).
     */
    StudyRunner.Outcome run(Plan plan, Path folder, Integer threads, boolean quiet, PrintWriter err) {
        int n = threads == null ? LocalExecutor.defaultThreads() : threads;
        if (n < 1) {
            throw new UsageException("--threads must be at least 1, got " + n);
        }
        boolean terminal = System.console() != null;
        Progress progress = quiet ? Progress.quiet() : Progress.lines(err, terminal, terminal ? 0.2 : 5.0);
        try {
            return runner().run(plan, new StudyRunner.Options(folder, n, progress, quiet ? null : err));
        } catch (StudyRunner.OutputFolderException | Journal.JournalException e) {
            throw new UsageException(e.getMessage(), e);
        }
    }
}

package dev.touchstone.harness.cli;

import dev.touchstone.harness.catalog.LearnerCatalog;
import dev.touchstone.harness.execution.GeneratorSimulator;
import dev.touchstone.harness.execution.Engine;
import dev.touchstone.harness.execution.Journal;
import dev.touchstone.harness.execution.MetricsAggregator;
import dev.touchstone.harness.execution.MetricsScorer;
import dev.touchstone.harness.execution.Progress;
import dev.touchstone.harness.execution.StudyRunner;
import dev.touchstone.harness.outside.CommandSpec;
import dev.touchstone.harness.outside.LearnersFile;
import dev.touchstone.harness.outside.LearnerSources;
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
import java.util.List;

/**
 * Wires the command line to the real parts: learner catalogue (built in, plug-ins from
 * {@code --plugins}, commands from {@code --learners}), the truth and metric catalogues,
 * the simulator, scorer and aggregator.
 */
final class Toolkit {

    final LearnerCatalog learners;
    final TruthCatalog truth = new GeneratorTruthCatalog();
    final MetricCatalog metrics = new RegistryMetricCatalog();
    private final LearnerSources sources;
    private final Path learnersFile;
    private final Path pluginDir;
    private boolean acceptVersionChange;

    Toolkit(Path learnersFile, Path pluginDir) {
        this.learnersFile = learnersFile;
        this.pluginDir = pluginDir;
        try {
            List<CommandSpec> commands = learnersFile == null ? List.of() : LearnersFile.read(learnersFile);
            this.sources = LearnerSources.gather(Toolkit.class.getClassLoader(), pluginDir, commands,
                    learnersFile == null ? null : learnersFile.toString());
        } catch (StudyException e) {
            throw new UsageException(e.getMessage(), e);
        } catch (IllegalArgumentException e) {
            throw new UsageException(e.getMessage(), e);
        }
        this.learners = sources.catalog();
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
            return new Expansion(truth, sources::fingerprint).expand(study, learners);
        } catch (StudyException e) {
            throw new UsageException(e.getMessage(), e);
        }
    }

    /**
     * Whether the report in the finished study's own folder {@code out} is current, so that
     * {@code report} has nothing to read or write: {@code finished.json} is there, was written
     * for this plan, this study text and this session's versions, still matches every file it
     * vouches for (the journal among them), and vouches for both report pages; the figures and
     * tables folders beside them exist. This reads the index and the files' metadata, never the
     * journal (see {@link dev.touchstone.harness.execution.FinishedIndex#matches}).
     */
    boolean reportIsCurrent(Plan plan, Path out) {
        var index = dev.touchstone.harness.execution.FinishedIndex.read(out);
        if (index == null || index.total() != plan.runCount()
                || !index.vouchesFor(dev.touchstone.harness.report.StudyReports.PAGES)
                || !java.nio.file.Files.isDirectory(out.resolve("figures"))
                || !java.nio.file.Files.isDirectory(out.resolve("tables"))) {
            return false;
        }
        return index.matches(out, dev.touchstone.harness.execution.FinishedIndex.Hashes.of(plan,
                dev.touchstone.harness.study.StudyWriter.yaml(plan.study()), versions()));
    }

    /** Writes report.html and report.md for the study in {@code out} (finished or partial) into {@code to}. */
    Path report(Plan plan, Path out, Path to) {
        Path html = dev.touchstone.harness.report.StudyReports.write(to, reportData(plan, out));
        vouchReport(out, to);
        return html;
    }

    /**
     * A report just written into a finished study's own folder is added to its {@code finished.json}
     * (nothing happens when the study is not finished), so a resume with nothing to do leaves it be.
     */
    static void vouchReport(Path out, Path to) {
        if (sameFolder(out, to)) {
            dev.touchstone.harness.execution.FinishedIndex.vouch(out, dev.touchstone.harness.report.StudyReports.PAGES);
        }
    }

    /** Whether a report written into {@code to} lands in the study's own folder {@code out}. */
    static boolean sameFolder(Path out, Path to) {
        return to.toAbsolutePath().normalize().equals(out.toAbsolutePath().normalize());
    }

    /**
     * The report of a study just run into {@code out}: rewritten, unless the session found the
     * study finished and its {@code finished.json} vouches for the report's pages as they are
     * (then nothing is read or written). A report written from a finished study is added to that marker.
     */
    Path reportAfterRun(Plan plan, StudyRunner.Outcome outcome, Path out) {
        List<String> pages = dev.touchstone.harness.report.StudyReports.PAGES;
        if (outcome.alreadyFinished()) {
            var index = dev.touchstone.harness.execution.FinishedIndex.read(out);
            if (index != null && index.vouchesFor(pages)) {
                return out.resolve(pages.get(0));
            }
        }
        return report(plan, out, out);
    }

    /** The report data of the study in {@code out}, from its journal. */
    dev.touchstone.reports.ReportData reportData(Plan plan, Path out) {
        return dev.touchstone.harness.report.ReportFolder.read(out, plan, new GeneratorSimulator(),
                new MetricsAggregator());
    }

    /** Lets {@link #run} resume a folder whose kept runs were made with other versions. */
    Toolkit acceptVersionChange(boolean accept) {
        this.acceptVersionChange = accept;
        return this;
    }

    /** The versions this session records: the tool's label and every learner's. */
    dev.touchstone.harness.execution.RunVersions versions() {
        String tool = dev.touchstone.harness.version.VersionInfo.current().label();
        return new dev.touchstone.harness.execution.RunVersions(tool,
                dev.touchstone.harness.outside.LearnerVersions.of(learners, tool));
    }

    StudyRunner runner() {
        return new StudyRunner(new GeneratorSimulator(), new MetricsScorer(), new MetricsAggregator());
    }

    /**
     * Runs (or resumes) a plan into {@code folder} with {@code threads} workers (see
     * {@link ThreadsOption#value()}), showing progress on {@code err} unless {@code quiet}: live on a terminal,
     * plain periodic lines otherwise. Bad thread counts and unusable folders or journals are
     * bad input (exit 2).
     */
    StudyRunner.Outcome run(Plan plan, Path folder, int threads, boolean quiet, PrintWriter err) {
        return run(plan, folder, threads, quiet, err, Engine.LOCAL);
    }

    /** Progress on {@code err} unless {@code quiet}: live on a terminal, plain lines every 5 s otherwise. */
    static Progress progress(boolean quiet, PrintWriter err) {
        boolean terminal = System.console() != null;
        return quiet ? Progress.quiet() : Progress.lines(err, terminal, terminal ? 0.2 : 5.0);
    }

    /** As {@link #run(Plan, Path, int, boolean, PrintWriter)}, on the given engine. */
    StudyRunner.Outcome run(Plan plan, Path folder, int n, boolean quiet, PrintWriter err, Engine engine) {
        Progress progress = progress(quiet, err);
        try {
            return runner().on(engine).keeping(dev.touchstone.harness.execution.RunRecipe.of(plan, learnersFile,
                            pluginDir)).recording(versions()).acceptingVersionChange(acceptVersionChange)
                    .run(plan, new StudyRunner.Options(folder, n, progress, quiet ? null : err));
        } catch (StudyRunner.OutputFolderException | StudyRunner.VersionChangeException | Journal.JournalException e) {
            throw new UsageException(e.getMessage(), e);
        }
    }
}

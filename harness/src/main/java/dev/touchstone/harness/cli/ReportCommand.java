package dev.touchstone.harness.cli;

import dev.touchstone.harness.execution.StudyRunner;
import dev.touchstone.harness.study.Plan;
import picocli.CommandLine.Command;
import picocli.CommandLine.Mixin;
import picocli.CommandLine.Option;
import picocli.CommandLine.Parameters;

import java.io.PrintWriter;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.Locale;
import java.util.concurrent.Callable;

/**
 * {@code touchstone report OUT [--out DIR]}: re-renders report.html and report.md of a study's
 * output folder from its journal, also while the study is running or after it was
 * interrupted (the report is then marked partial). On a finished study whose {@code finished.json}
 * still vouches for the report in its own folder (same plan, study text and versions, no vouched
 * file changed), nothing is re-read or rewritten: the index and file metadata are all it reads.
 */
@Command(name = "report", description = "Re-render the report of a finished or partial study from its output folder.")
final class ReportCommand implements Callable<Integer> {

    @Parameters(paramLabel = "OUT", description = "The study's output folder (holding study.yaml and journal.jsonl).")
    Path out;

    @Option(names = "--out", paramLabel = "DIR", description = "Where to write the report (default: the study's output folder).")
    Path to;

    @Mixin
    LearnerSourceOptions sources;

    @picocli.CommandLine.Spec
    picocli.CommandLine.Model.CommandSpec spec;

    @Override
    public Integer call() {
        Path study = out.resolve("study.yaml");
        if (!Files.isRegularFile(study) || !Files.isRegularFile(out.resolve("journal.jsonl"))) {
            throw new UsageException(out + ": not a study's output folder (it needs study.yaml and journal.jsonl)");
        }
        Path learners = sources.learnersFile != null ? sources.learnersFile : StudyRunner.keptLearnersFile(out);
        Toolkit kit = new Toolkit(learners, sources.plugins);
        Plan plan = kit.plan(kit.readStudy(study));
        Path target = to == null ? out : to;
        // A finished study whose index vouches for its report as it is: nothing to re-read.
        boolean current = Toolkit.sameFolder(out, target) && kit.reportIsCurrent(plan, out);
        Path html = current ? out.resolve(dev.touchstone.harness.report.StudyReports.HTML_FILE)
                : kit.report(plan, out, target);
        PrintWriter w = spec.commandLine().getOut();
        w.printf(Locale.ROOT, "report: %s%n", html);
        w.flush();
        return Main.DONE;
    }
}

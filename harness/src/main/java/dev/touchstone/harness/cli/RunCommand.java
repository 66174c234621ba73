package dev.touchstone.harness.cli;

import dev.touchstone.harness.execution.StudyRunner;
import dev.touchstone.harness.study.Plan;
import dev.touchstone.metrics.results.RunStatus;
import picocli.CommandLine.Command;
import picocli.CommandLine.Option;
import picocli.CommandLine.Parameters;

import java.io.PrintWriter;
import java.nio.file.Path;
import java.util.Locale;
import java.util.concurrent.Callable;

/** {@code touchstone run STUDY}: runs a study, or resumes it in an existing output folder. */
@Command(name = "run", description = "Run a study, or resume it in an existing output folder.")
final class RunCommand implements Callable<Integer> {

    @Parameters(paramLabel = "STUDY", description = "The study file (YAML or JSON).")
    Path study;

    @Option(names = "--out", paramLabel = "DIR", description = "Output folder (default: ./<study name>-results).")
    Path out;

    @Option(names = "--threads", paramLabel = "N", description = "Worker threads (default: all cores).")
    Integer threads;

    @Option(names = "--learners", paramLabel = "FILE", description = "A learners file declaring external command learners.")
    Path learnersFile;

    @Option(names = "--plugins", paramLabel = "DIR", description = "A folder of plug-in jars with Learner services.")
    Path plugins;

    @Option(names = "--quiet", description = "Print no progress, only the final line.")
    boolean quiet;

    @picocli.CommandLine.Spec
    picocli.CommandLine.Model.CommandSpec spec;

    @Override
    public Integer call() {
        PrintWriter out = spec.commandLine().getOut();
        PrintWriter err = spec.commandLine().getErr();
        Toolkit kit = new Toolkit(learnersFile, plugins);
        Plan plan = kit.plan(kit.readStudy(study));
        Path folder = this.out != null ? this.out : Path.of(plan.study().name() + "-results");
        StudyRunner.Outcome o = kit.run(plan, folder, threads, quiet, err);
        out.printf(Locale.ROOT, "done: %,d runs (%,d ok, %,d failed, %,d timed out, %,d skipped; %,d done now);"
                        + " results in %s%n", o.total(), o.count(RunStatus.OK), o.count(RunStatus.FAILED),
                o.count(RunStatus.TIMEOUT), o.count(RunStatus.SKIPPED), o.performed(), folder);
        out.printf(Locale.ROOT, "report: %s%n", kit.report(plan, folder, folder));
        out.flush();
        return Main.DONE;
    }
}

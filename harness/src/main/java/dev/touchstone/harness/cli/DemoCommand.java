package dev.touchstone.harness.cli;

import dev.touchstone.harness.execution.StudyRunner;
import dev.touchstone.harness.study.Plan;
import dev.touchstone.metrics.results.RunStatus;
import dev.touchstone.reports.MarkdownReport;
import dev.touchstone.reports.ReportData;
import picocli.CommandLine.Command;
import picocli.CommandLine.Mixin;
import picocli.CommandLine.Option;

import java.io.IOException;
import java.io.InputStream;
import java.io.PrintWriter;
import java.io.UncheckedIOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.Locale;
import java.util.concurrent.Callable;

/**
 * {@code touchstone demo [--out DIR]}: runs the bundled quick study (scenarios/demo.yaml),
 * prints its headline table and writes the report. Run again on the same folder, it
 * reuses the runs already done.
 */
@Command(name = "demo", description = "Run the bundled quick study, print its headline table and write its report.")
final class DemoCommand implements Callable<Integer> {

    /** The bundled study, packaged from scenarios/ into the jar. */
    static final String STUDY = "/scenarios/demo.yaml";

    @Option(names = "--out", paramLabel = "DIR", description = "Output folder (default: ./touchstone-demo).")
    Path out = Path.of("touchstone-demo");

    @Mixin
    ThreadsOption threads;

    @Option(names = "--quiet", description = "Print no progress.")
    boolean quiet;

    @Option(names = "--accept-version-change", description = "Resume a demo folder made with another version"
            + " (its runs keep their versions; the report says the study is mixed).")
    boolean acceptVersionChange;

    /** For tests: a study file to use instead of the bundled one. */
    @Option(names = "--study", hidden = true)
    Path study;

    @picocli.CommandLine.Spec
    picocli.CommandLine.Model.CommandSpec spec;

    @Override
    public Integer call() {
        PrintWriter w = spec.commandLine().getOut();
        PrintWriter err = spec.commandLine().getErr();
        Toolkit kit = new Toolkit(null, null).acceptVersionChange(acceptVersionChange);
        Path file = study != null ? study : bundledStudy();
        Plan plan = kit.plan(kit.readStudy(file));
        StudyRunner.Outcome o = kit.run(plan, out, threads.value(), quiet, err);
        ReportData data = kit.reportData(plan, out);
        Path html = dev.touchstone.harness.report.StudyReports.write(out, data);
        Toolkit.vouchReport(out, out);
        w.printf(Locale.ROOT, "demo study '%s': %,d runs (%,d ok, %,d failed, %,d timed out, %,d skipped)%n%n",
                plan.study().name(), o.total(), o.count(RunStatus.OK), o.count(RunStatus.FAILED),
                o.count(RunStatus.TIMEOUT), o.count(RunStatus.SKIPPED));
        w.print(MarkdownReport.headline(data));
        w.printf(Locale.ROOT, "%nreport: %s%nall files: %s%n", html.toAbsolutePath(), out.toAbsolutePath());
        w.flush();
        return Main.DONE;
    }

    private static Path bundledStudy() {
        try (InputStream in = DemoCommand.class.getResourceAsStream(STUDY)) {
            if (in == null) {
                throw new IllegalStateException("the bundled study " + STUDY + " is missing from the jar");
            }
            Path tmp = Files.createTempFile("touchstone-demo", ".yaml");
            tmp.toFile().deleteOnExit();
            Files.write(tmp, in.readAllBytes());
            return tmp;
        } catch (IOException e) {
            throw new UncheckedIOException(e);
        }
    }
}

package dev.touchstone.harness.cli;

import dev.touchstone.harness.execution.Engine;
import dev.touchstone.harness.execution.EngineProvider;
import dev.touchstone.harness.execution.RunRecipe;
import dev.touchstone.harness.execution.StudyRunner;
import dev.touchstone.harness.study.Plan;
import dev.touchstone.metrics.results.RunStatus;
import picocli.CommandLine.Command;
import picocli.CommandLine.Mixin;
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

    @Mixin
    ThreadsOption threads;

    @Mixin
    LearnerSourceOptions sources;

    @Option(names = "--engine", paramLabel = "NAME", description = "Where runs are performed: local (default) or"
            + " spark (needs the spark module; see docs/spark.md).")
    String engine = EngineProvider.LOCAL_NAME;

    @Option(names = "--master", paramLabel = "URL", description = "The cluster of the engine, e.g. local[2],"
            + " spark://host:7077 or yarn (default: the engine's own).")
    String master;

    @Option(names = "--quiet", description = "Print no progress, only the final line.")
    boolean quiet;

    @Option(names = "--accept-version-change", description = "Resume even though the runs kept in the output folder"
            + " were made with another version of the tool or of a learner; each run keeps the versions it was made"
            + " with, and provenance and the report say the study is mixed.")
    boolean acceptVersionChange;

    @picocli.CommandLine.Spec
    picocli.CommandLine.Model.CommandSpec spec;

    @Override
    public Integer call() {
        PrintWriter out = spec.commandLine().getOut();
        PrintWriter err = spec.commandLine().getErr();
        Toolkit kit = sources.toolkit().acceptVersionChange(acceptVersionChange);
        Plan plan = kit.plan(kit.readStudy(study));
        Path folder = this.out != null ? this.out : Path.of(plan.study().name() + "-results");
        StudyRunner.Outcome o = kit.run(plan, folder, threads.value(), quiet, err, engine(plan));
        out.printf(Locale.ROOT, "done: %,d runs (%,d ok, %,d failed, %,d timed out, %,d skipped; %,d done now);"
                        + " results in %s%n", o.total(), o.count(RunStatus.OK), o.count(RunStatus.FAILED),
                o.count(RunStatus.TIMEOUT), o.count(RunStatus.SKIPPED), o.performed(), folder);
        out.printf(Locale.ROOT, "report: %s%n", kit.reportAfterRun(plan, o, folder));
        out.flush();
        return Main.DONE;
    }

    /** The engine named by {@code --engine}, configured with {@code --master}. */
    private Engine engine(Plan plan) {
        if (engine.equals(EngineProvider.LOCAL_NAME)) {
            if (master != null) {
                throw new UsageException("--master is for a cluster engine; the local engine uses --threads");
            }
            return Engine.LOCAL;
        }
        EngineProvider p = EngineProvider.find(engine, RunCommand.class.getClassLoader());
        if (p == null) {
            throw new UsageException("the engine '" + engine + "' is not on the class path (available: "
                    + String.join(", ", EngineProvider.available(RunCommand.class.getClassLoader()))
                    + "); for spark build it with `mvn -B -pl spark -am package -DskipTests` and run through"
                    + " ./touchstone, which then adds it (docs/spark.md)");
        }
        try {
            return p.create(master, plan, RunRecipe.of(plan, sources.learnersFile, sources.plugins));
        } catch (IllegalArgumentException e) {
            throw new UsageException(e.getMessage(), e);
        }
    }
}

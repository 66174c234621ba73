package dev.touchstone.harness.cli;

import dev.touchstone.core.graph.GraphClass;
import dev.touchstone.core.graph.algorithms.Cpdags;
import dev.touchstone.metrics.truth.TruthSelection;
import dev.touchstone.harness.execution.GeneratorSimulator;
import dev.touchstone.harness.execution.Replicate;
import dev.touchstone.harness.execution.StudyRunner;
import dev.touchstone.harness.io.AtomicFiles;
import dev.touchstone.harness.io.DataCsv;
import dev.touchstone.harness.io.GraphDot;
import dev.touchstone.harness.io.GraphJson;
import dev.touchstone.harness.study.Canonical;
import dev.touchstone.harness.study.Plan;
import dev.touchstone.harness.study.ReplicateSeeds;
import dev.touchstone.harness.study.SampleSize;
import dev.touchstone.harness.study.TruthSetting;
import picocli.CommandLine.Command;
import picocli.CommandLine.Option;
import picocli.CommandLine.Parameters;

import java.nio.file.Files;
import java.nio.file.Path;
import java.util.Locale;
import java.util.concurrent.Callable;

/**
 * {@code touchstone simulate STUDY --out DIR}: writes every replicate's data and truth
 * without running learners, exactly as {@code run} would draw them (same seeds).
 *
 * <p>Layout: {@code DIR/replicates.csv} indexes {@code DIR/t<setting>-r<replicate>/} folders, each
 * with {@code data.csv} (the largest sample size; smaller ones are its first rows),
 * {@code dag.json} and {@code dag.dot} (hidden variables flagged), {@code pag.json} (over the
 * observed variables) and, when nothing is hidden, {@code cpdag.json}, else {@code mag.json}.
 */
@Command(name = "simulate", description = "Write every replicate's data and truth graphs, without running learners.")
final class SimulateCommand implements Callable<Integer> {

    @Parameters(paramLabel = "STUDY", description = "The study file (YAML or JSON).")
    Path study;

    @Option(names = "--out", required = true, paramLabel = "DIR", description = "Output folder.")
    Path out;

    @Option(names = "--learners", paramLabel = "FILE", description = "A learners file, if the study names command learners.")
    Path learnersFile;

    @Option(names = "--plugins", paramLabel = "DIR", description = "A folder of plug-in jars, if the study names plug-ins.")
    Path plugins;

    @picocli.CommandLine.Spec
    picocli.CommandLine.Model.CommandSpec spec;

    @Override
    public Integer call() throws Exception {
        Toolkit kit = new Toolkit(learnersFile, plugins);
        Plan plan = kit.plan(kit.readStudy(study));
        int rows = StudyRunner.largestRows(plan);
        Files.createDirectories(out);
        GeneratorSimulator sim = new GeneratorSimulator();
        StringBuilder index = new StringBuilder("folder,truth_setting,replicate,rows,seed,setting\n");
        int written = 0;
        for (TruthSetting t : plan.truths()) {
            for (int r = 0; r < plan.study().replicates(); r++) {
                ReplicateSeeds seeds = new ReplicateSeeds(plan.study().seed(), t, r);
                Replicate rep = sim.draw(t, seeds, rows);
                String name = String.format(Locale.ROOT, "t%d-r%d", t.index(), r);
                Path dir = out.resolve(name);
                Files.createDirectories(dir);
                if (rep.data() != null) {
                    DataCsv.write(dir.resolve("data.csv"), rep.data());
                }
                GraphJson.write(dir.resolve("dag.json"), rep.trueDag());
                GraphDot.write(dir.resolve("dag.dot"), rep.trueDag(), "true DAG " + name);
                if (!rep.trueDag().hasHidden()) {
                    GraphJson.write(dir.resolve("cpdag.json"), Cpdags.of(rep.trueDag()));
                } else {
                    GraphJson.write(dir.resolve("mag.json"), TruthSelection.as(rep.trueDag(), GraphClass.MAG).reference());
                }
                GraphJson.write(dir.resolve("pag.json"), TruthSelection.as(rep.trueDag(), GraphClass.PAG).reference());
                index.append(name).append(',').append(t.index()).append(',').append(r).append(',').append(rows)
                        .append(',').append(seeds.replicateSeed()).append(",\"").append(t.label().replace("\"", "'"))
                        .append("\"\n");
                written++;
            }
        }
        AtomicFiles.writeString(out.resolve("replicates.csv"), index.toString());
        StringBuilder samples = new StringBuilder();
        for (SampleSize n : plan.study().samples()) {
            samples.append(samples.length() == 0 ? "" : ", ").append(n.word());
        }
        spec.commandLine().getOut().printf(Locale.ROOT, "wrote %,d replicates (%s rows each; sample sizes %s are"
                + " prefixes) to %s%n", written, Canonical.value(rows), samples, out);
        spec.commandLine().getOut().flush();
        return Main.DONE;
    }
}

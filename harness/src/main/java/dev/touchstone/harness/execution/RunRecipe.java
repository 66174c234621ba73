package dev.touchstone.harness.execution;

import dev.touchstone.harness.catalog.LearnerCatalog;
import dev.touchstone.harness.outside.CommandSpec;
import dev.touchstone.harness.outside.LearnersFile;
import dev.touchstone.harness.outside.LearnerSources;
import dev.touchstone.harness.study.Expansion;
import dev.touchstone.harness.study.GeneratorTruthCatalog;
import dev.touchstone.harness.study.NodeReader;
import dev.touchstone.harness.study.Plan;
import dev.touchstone.harness.study.RegistryMetricCatalog;
import dev.touchstone.harness.study.StudyReader;
import dev.touchstone.harness.study.StudyWriter;

import java.io.IOException;
import java.io.Serializable;
import java.io.UncheckedIOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;

/**
 * Everything a worker on another machine needs to rebuild a study's plan exactly: the
 * normalised study text (which reads back to the same plan, same keys and seeds), the text
 * of the learners file with the folder it came from, and the plug-in folder. Only text
 * travels; learners, truth and metrics are rebuilt from the worker's own class path, so a
 * worker with another Touchstone version yields other keys, which the engine detects.
 *
 * @param studyText       the study as normalised by {@link StudyWriter}
 * @param learnersSource  the learners file's path as given (messages, {@code .json} detection), or null
 * @param learnersText    the learners file's text, or null
 * @param learnersDir     the folder of the learners file ({@code {dir}} in commands), or null
 * @param pluginDir       the plug-in folder, or null
 */
public record RunRecipe(String studyText, String learnersSource, String learnersText, String learnersDir,
                        String pluginDir) implements Serializable {

    private static final long serialVersionUID = 1L;

    /** The recipe of a plan read with these learners and plug-in options (each may be null). */
    public static RunRecipe of(Plan plan, Path learnersFile, Path pluginDir) {
        String text = null;
        String dir = null;
        if (learnersFile != null) {
            try {
                text = Files.readString(learnersFile, StandardCharsets.UTF_8);
            } catch (IOException e) {
                throw new UncheckedIOException("cannot read " + learnersFile + ": " + e.getMessage(), e);
            }
            dir = learnersFile.toAbsolutePath().getParent().toString();
        }
        return new RunRecipe(StudyWriter.yaml(plan.study()), learnersFile == null ? null : learnersFile.toString(),
                text, dir, pluginDir == null ? null : pluginDir.toString());
    }

    /** The command learners the learners file declares (empty without one). */
    public List<CommandSpec> commands() {
        if (learnersText == null) {
            return List.of();
        }
        return LearnersFile.read(learnersSource, learnersText, Path.of(learnersDir));
    }

    /** What a worker builds once from the recipe: the plan and the means to perform its runs. */
    public record Workbench(Plan plan, Simulator simulator, RunPerformer performer) {
    }

    /**
     * Rebuilds the plan with the built-in learners of this class path, the plug-ins and the
     * command learners, and the real simulator and scorer. Costs one study expansion.
     */
    public Workbench rebuild() {
        LearnerSources sources = LearnerSources.gather(RunRecipe.class.getClassLoader(),
                pluginDir == null ? null : Path.of(pluginDir), commands(), learnersSource);
        LearnerCatalog learners = sources.catalog();
        GeneratorTruthCatalog truth = new GeneratorTruthCatalog();
        var study = new StudyReader(truth, learners, new RegistryMetricCatalog())
                .read(NodeReader.read(StudyRunner.STUDY_FILE, studyText, false));
        Plan plan = new Expansion(truth, sources::fingerprint).expand(study, learners);
        return new Workbench(plan, new GeneratorSimulator(),
                new RunPerformer(new MetricsScorer(), new SettingLayout(plan)));
    }
}

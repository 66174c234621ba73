package dev.touchstone.harness.execution;

import dev.touchstone.harness.study.Canonical;
import dev.touchstone.harness.study.Plan;
import dev.touchstone.harness.study.RunDefinition;
import dev.touchstone.harness.study.SampleSize;
import dev.touchstone.harness.study.StudyWriter;
import dev.touchstone.metrics.results.RunResult;
import dev.touchstone.metrics.results.RunStatus;

import java.io.IOException;
import java.io.PrintWriter;
import java.io.UncheckedIOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.time.Instant;
import java.util.AbstractMap;
import java.util.ArrayList;
import java.util.HashSet;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.Set;
import java.util.concurrent.ConcurrentHashMap;
import java.util.stream.Stream;

/**
 * Runs or resumes an expanded study in an output folder and writes its files:
 * {@code study.yaml}, {@code provenance.json}, {@code journal.jsonl}, {@code runs.csv},
 * {@code summary.csv}, {@code comparisons.csv}, each written whole or not at all.
 *
 * <p>On an existing folder it resumes: runs whose key is already in the journal are kept,
 * runs whose definition changed (same coordinates, different key) and new runs are done,
 * and the counts are said. Tables are always rebuilt from the journal, in plan order, so
 * they are identical for any thread count, order or number of interruptions.
 *
 * <p>A session that finishes every run ends by writing {@link FinishedIndex} ({@code
 * finished.json}); a later session of the same plan, study text and versions that finds it
 * matching the folder has nothing to do and returns at once, reading and writing nothing
 * else (see {@link FinishedIndex} for what is checked).
 */
public final class StudyRunner {

    public static final String STUDY_FILE = "study.yaml";
    public static final String PROVENANCE_FILE = "provenance.json";
    public static final String RUNS_FILE = "runs.csv";
    public static final String SUMMARY_FILE = "summary.csv";
    public static final String COMPARISONS_FILE = "comparisons.csv";

    /** The copy of the learners file a study was run with, kept so that its report needs no learners file. */
    public static final String LEARNERS_COPY = "learners-used";

    private final Simulator simulator;
    private final Scorer scorer;
    private final Aggregator aggregator;
    private final Engine engine;
    private final RunRecipe recipe;
    private final RunVersions versions;
    private final boolean acceptVersionChange;

    public StudyRunner(Simulator simulator, Scorer scorer, Aggregator aggregator) {
        this(simulator, scorer, aggregator, Engine.LOCAL, null, RunVersions.current(), false);
    }

    private StudyRunner(Simulator simulator, Scorer scorer, Aggregator aggregator, Engine engine, RunRecipe recipe,
                        RunVersions versions, boolean acceptVersionChange) {
        this.simulator = simulator;
        this.scorer = scorer;
        this.aggregator = aggregator;
        this.engine = engine;
        this.recipe = recipe;
        this.versions = versions;
        this.acceptVersionChange = acceptVersionChange;
    }

    /** The same runner performing runs on another engine; journal, resume and outputs are unchanged. */
    public StudyRunner on(Engine other) {
        return new StudyRunner(simulator, scorer, aggregator, java.util.Objects.requireNonNull(other, "engine"),
                recipe, versions, acceptVersionChange);
    }

    /**
     * The same runner keeping the recipe's learners file in the output folder ({@link
     * #LEARNERS_COPY} with the file's extension), so that a report rebuilds the plan without it.
     */
    public StudyRunner keeping(RunRecipe other) {
        return new StudyRunner(simulator, scorer, aggregator, engine, other, versions, acceptVersionChange);
    }

    /** The same runner recording these versions with every run (and comparing kept runs with them). */
    public StudyRunner recording(RunVersions other) {
        return new StudyRunner(simulator, scorer, aggregator, engine, recipe,
                java.util.Objects.requireNonNull(other, "versions"), acceptVersionChange);
    }

    /**
     * The same runner resuming even when kept runs were made with other versions; the runs
     * keep the versions they were made with, and provenance and the report say the study is mixed.
     */
    public StudyRunner acceptingVersionChange(boolean accept) {
        return new StudyRunner(simulator, scorer, aggregator, engine, recipe, versions, accept);
    }

    /**
     * How to run.
     *
     * @param out      the output folder (created if missing)
     * @param threads  worker threads
     * @param progress progress listener
     * @param messages where to say what is resumed (one line each)
     * @param shuffle  a seed to start runs in a shuffled order (tests of order independence), or null for plan order
     */
    public record Options(Path out, int threads, Progress progress, PrintWriter messages, Long shuffle) {
        public Options(Path out, int threads, Progress progress, PrintWriter messages) {
            this(out, threads, progress, messages, null);
        }
    }

    /**
     * What a session did: runs in the study, already done, redone because changed, done now, runs by
     * status, and whether the study was found finished by its {@link FinishedIndex} (then nothing was
     * read beyond it, nor written).
     */
    public record Outcome(int total, int reused, int changed, int performed, Map<RunStatus, Integer> byStatus,
                          Path out, boolean alreadyFinished) {
        public Outcome(int total, int reused, int changed, int performed, Map<RunStatus, Integer> byStatus, Path out) {
            this(total, reused, changed, performed, byStatus, out, false);
        }

        public int count(RunStatus s) {
            return byStatus.getOrDefault(s, 0);
        }
    }

    public Outcome run(Plan plan, Options options) {
        Path out = options.out();
        prepareFolder(out, plan.study().name());
        Instant started = Instant.now();
        String studyText = StudyWriter.yaml(plan.study());
        String studyHash = Canonical.hash(studyText);
        String versionsHash = FinishedIndex.versionsHash(versions);
        String planHash = plan.hash();
        Outcome finished = alreadyFinished(plan, out, planHash, studyHash, versionsHash);
        if (finished != null) {
            if (options.messages() != null) {
                options.messages().printf(java.util.Locale.ROOT, "resuming in %s: %,d of %,d runs already done; 0 to do"
                        + " (the study is finished: %s matches the journal)%n", out, finished.total(), finished.total(),
                        FinishedIndex.FILE_NAME);
                options.messages().flush();
            }
            options.progress().start(finished.total(), finished.total());
            options.progress().end();
            return finished;
        }

        SettingLayout layout = new SettingLayout(plan);
        Map<Integer, RunResult> results = new ConcurrentHashMap<>();
        int reused = 0;
        int changed = 0;
        List<RunDefinition> todo = new ArrayList<>();
        VersionLedger ledger;
        try (Journal journal = Journal.open(out.resolve(Journal.FILE_NAME))) {
            Map<String, JournalCodec.Line> existing = journal.existing();
            ledger = VersionLedger.of(plan, existing, versions);
            if (!ledger.changes().isEmpty() && !acceptVersionChange) {
                throw new VersionChangeException(ledger.refusal(out));
            }
            // Only once the journal has been read and found sound: a damaged one is refused
            // with the folder as it was. The finished marker goes first: it must never vouch for
            // files this session is about to change.
            FinishedIndex.remove(out);
            OutputFiles.write(out.resolve(STUDY_FILE), studyText);
            keepLearnersFile(out);
            Provenance running = provenance(plan, studyText, options.threads(), started, null, Map.of(), ledger);
            OutputFiles.write(out.resolve(PROVENANCE_FILE), running.json());
            Set<String> oldCoordinates = new HashSet<>();
            for (JournalCodec.Line l : existing.values()) {
                oldCoordinates.add(l.coordinates());
            }
            for (RunDefinition r : plan.runs()) {
                JournalCodec.Line done = existing.get(r.key());
                if (done != null) {
                    results.put(r.index(), done.result());
                    reused++;
                } else {
                    if (oldCoordinates.contains(r.coordinates())) {
                        changed++;
                    }
                    todo.add(r);
                }
            }
            say(options, journal, plan, reused, changed, todo.size());
            options.progress().start(plan.runs().size(), reused);
            if (options.shuffle() != null) {
                dev.touchstone.core.random.Shuffles.shuffle(dev.touchstone.core.random.Seeds.random(options.shuffle()), todo);
            }
            RunPerformer performer = new RunPerformer(scorer, layout);
            RunExecutor executor = engine.executor(options.threads(), simulator, performer);
            Map<String, Integer> indexByKey = new LinkedHashMap<>();
            for (RunDefinition r : todo) {
                indexByKey.put(r.key(), r.index());
            }
            executor.execute(todo, largestRows(plan), performed -> {
                RunResult result = performed.result();
                int index = indexByKey.get(result.key());
                RunDefinition def = plan.runs().get(index);
                RunVersions.Stamp stamp = versions.stamp(def.config().learner().description().id());
                journal.append(new JournalCodec.Line(index, def.coordinates(), result, stamp), performed.estimate(),
                        line -> {
                    results.put(line.run(), line.result());
                    options.progress().finished(line.result());
                });
            });
        }
        options.progress().end();
        if (results.size() != plan.runs().size()) {
            throw new IllegalStateException("only " + results.size() + " of " + plan.runs().size()
                    + " runs have results; the journal may be damaged");
        }
        List<Map.Entry<Integer, RunResult>> ordered = new ArrayList<>();
        List<RunResult> list = new ArrayList<>();
        Map<RunStatus, Integer> byStatus = new LinkedHashMap<>();
        for (RunDefinition r : plan.runs()) {
            RunResult res = results.get(r.index());
            ordered.add(new AbstractMap.SimpleEntry<>(r.index(), res));
            list.add(res);
            byStatus.merge(res.status(), 1, Integer::sum);
        }
        List<String> structural = new ArrayList<>();
        for (String m : plan.study().allMetrics()) {
            if (!Scorer.MEASURED.contains(m)) {
                structural.add(m);
            }
        }
        SettingCells columns = SettingCells.of(plan, layout);
        OutputFiles.write(out.resolve(RUNS_FILE), ResultTables.runs(columns, structural, ordered));
        long statsSeed = dev.touchstone.core.random.Seeds.derive(plan.study().seed(), "statistics");
        OutputFiles.write(out.resolve(SUMMARY_FILE), ResultTables.summary(columns,
                aggregator.summarise(list, plan.study().allMetrics(), statsSeed)));
        var reference = plan.reference();
        OutputFiles.write(out.resolve(COMPARISONS_FILE), ResultTables.comparisons(columns, reference == null
                ? List.of() : aggregator.compare(list, plan.study().allMetrics(), reference.label(), statsSeed)));
        Map<String, Integer> counts = new LinkedHashMap<>();
        counts.put("total", plan.runs().size());
        for (RunStatus s : RunStatus.values()) {
            counts.put(s.word(), byStatus.getOrDefault(s, 0));
        }
        counts.put("done_this_session", todo.size());
        OutputFiles.write(out.resolve(PROVENANCE_FILE), provenance(plan, studyText, options.threads(), started,
                Instant.now(), counts, ledger).json());
        List<String> vouched = new ArrayList<>(List.of(Journal.FILE_NAME, Journal.ESTIMATES_FILE, STUDY_FILE,
                PROVENANCE_FILE, RUNS_FILE, SUMMARY_FILE, COMPARISONS_FILE));
        vouched.addAll(FinishedIndex.present(out, List.of(LEARNERS_COPY + ".yaml", LEARNERS_COPY + ".json")));
        FinishedIndex.of(out, planHash, studyHash, versionsHash, !ledger.changes().isEmpty(), counts, vouched)
                .write(out);
        return new Outcome(plan.runs().size(), reused, changed, todo.size(), byStatus, out);
    }

    /**
     * The outcome of a session with nothing to do, when the folder's {@link FinishedIndex} matches
     * this plan, study text, versions and learners file; null when the journal must be read.
     */
    private Outcome alreadyFinished(Plan plan, Path out, String planHash, String studyHash, String versionsHash) {
        FinishedIndex index = FinishedIndex.read(out);
        if (index == null || index.total() != plan.runs().size() || index.versionChanges() && !acceptVersionChange
                || !index.matches(out, planHash, studyHash, versionsHash) || !sameLearnersCopy(out)) {
            return null;
        }
        return new Outcome(index.total(), index.total(), 0, 0, index.byStatus(), out, true);
    }

    /**
     * Whether this session would keep no other learners file than the one kept already. Without
     * one it keeps none, and the kept copy stays (the run keys already cover every command the plan uses).
     */
    private boolean sameLearnersCopy(Path out) {
        if (recipe == null || recipe.learnersText() == null) {
            return true;
        }
        Path kept = keptLearnersFile(out);
        try {
            return kept != null && Files.readString(kept).equals(recipe.learnersText());
        } catch (IOException e) {
            return false;
        }
    }

    /** The number of rows each replicate's draw needs: the largest finite sample size, 0 for oracle-only studies. */
    public static int largestRows(Plan plan) {
        int rows = 0;
        for (SampleSize n : plan.study().samples()) {
            if (!n.isOracle()) {
                rows = Math.max(rows, n.intRows());
            }
        }
        return rows;
    }

    private static void say(Options o, Journal journal, Plan plan, int reused, int changed, int todo) {
        PrintWriter w = o.messages();
        if (w == null) {
            return;
        }
        if (journal.hadTornLine()) {
            w.println("the journal's last line was torn (the previous session was interrupted while writing it);"
                    + " it was ignored and its run will be redone");
        }
        if (!journal.existing().isEmpty()) {
            w.printf(java.util.Locale.ROOT, "resuming in %s: %,d of %,d runs already done", o.out(), reused,
                    plan.runs().size());
            if (changed > 0) {
                w.printf(java.util.Locale.ROOT, "; %,d runs whose definition changed will be recomputed", changed);
            }
            w.printf(java.util.Locale.ROOT, "; %,d to do%n", todo);
        }
        w.flush();
    }

    private void keepLearnersFile(Path out) {
        if (recipe == null || recipe.learnersText() == null) {
            return;
        }
        boolean json = recipe.learnersSource().toLowerCase(java.util.Locale.ROOT).endsWith(".json");
        OutputFiles.write(out.resolve(LEARNERS_COPY + (json ? ".json" : ".yaml")), recipe.learnersText());
    }

    /** The copy of the learners file kept in a study's output folder, or null when there is none. */
    public static Path keptLearnersFile(Path out) {
        for (String ext : List.of(".yaml", ".json")) {
            Path p = out.resolve(LEARNERS_COPY + ext);
            if (Files.isRegularFile(p)) {
                return p;
            }
        }
        return null;
    }

    private static void prepareFolder(Path out, String studyName) {
        try {
            if (Files.exists(out) && !Files.isDirectory(out)) {
                throw new OutputFolderException("the output " + out + " exists and is not a folder");
            }
            String other = recordedStudyName(out);
            if (other != null && !other.equals(studyName)) {
                throw new OutputFolderException("the folder " + out + " holds the journal of another study ('" + other
                        + "', not '" + studyName + "'); choose another --out");
            }
            if (Files.isDirectory(out) && !Files.exists(out.resolve(Journal.FILE_NAME))) {
                try (Stream<Path> s = Files.list(out)) {
                    if (s.findAny().isPresent()) {
                        throw new OutputFolderException("the folder " + out + " is not empty and holds no "
                                + Journal.FILE_NAME + ", so it is not a study's output; choose another --out");
                    }
                }
            }
            Files.createDirectories(out);
        } catch (IOException e) {
            throw new UncheckedIOException("cannot prepare the output folder " + out + ": " + e.getMessage(), e);
        }
    }

    /**
     * The name of the study whose journal a folder holds, from its provenance, or null when
     * it holds none (or no readable provenance).
     */
    static String recordedStudyName(Path out) {
        Path prov = out.resolve(PROVENANCE_FILE);
        if (!Files.exists(out.resolve(Journal.FILE_NAME)) || !Files.isRegularFile(prov)) {
            return null;
        }
        try {
            var node = new com.fasterxml.jackson.databind.ObjectMapper().readTree(prov.toFile()).path("study")
                    .path("name");
            return node.isTextual() ? node.asText() : null;
        } catch (IOException e) {
            return null;
        }
    }

    private Provenance provenance(Plan plan, String studyText, int threads, Instant started, Instant finished,
                                  Map<String, Integer> counts, VersionLedger ledger) {
        var v = dev.touchstone.harness.version.VersionInfo.current();
        return new Provenance(v.version(), v.commit() + (v.dirty() ? "-dirty" : ""), plan.study().name(),
                plan.hash(), Canonical.hash(studyText), threads, started, finished, counts,
                new Provenance.Versions(versions, ledger));
    }

    /** Kept runs were made with other versions than this session's, and the change was not accepted. */
    public static final class VersionChangeException extends dev.touchstone.harness.BadInputException {
        private static final long serialVersionUID = 1L;

        public VersionChangeException(String message) {
            super(message);
        }
    }

    /** The output folder cannot be used. */
    public static final class OutputFolderException extends dev.touchstone.harness.BadInputException {
        private static final long serialVersionUID = 1L;

        public OutputFolderException(String message) {
            super(message);
        }
    }
}

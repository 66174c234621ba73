package dev.touchstone.harness.execution;

import dev.touchstone.harness.study.Plan;
import dev.touchstone.harness.study.SampleSize;
import dev.touchstone.harness.study.StudyWriter;
import dev.touchstone.metrics.results.RunStatus;

import java.io.PrintWriter;
import java.nio.file.Path;
import java.time.Instant;
import java.util.Map;

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
     * What a session did: the runs counted ({@link Tally}), runs by status, and whether the study
     * was found finished by its {@link FinishedIndex} (then nothing was read beyond it, nor written).
     */
    public record Outcome(Tally runs, Map<RunStatus, Integer> byStatus, Path out, boolean alreadyFinished) {

        /**
         * The runs of a session.
         *
         * @param total     runs in the study
         * @param reused    runs already done, kept from the journal
         * @param changed   runs redone because their definition changed
         * @param performed runs done in this session
         */
        public record Tally(int total, int reused, int changed, int performed) {
        }

        public int total() {
            return runs.total();
        }

        public int reused() {
            return runs.reused();
        }

        public int changed() {
            return runs.changed();
        }

        public int performed() {
            return runs.performed();
        }

        public int count(RunStatus s) {
            return byStatus.getOrDefault(s, 0);
        }
    }

    /**
     * Runs or resumes the plan: plan the session against the journal ({@link SessionPlan}), perform
     * the runs to do ({@link RunBatch}) recording each in the journal ({@link JournalRecorder}), then
     * write the tables, provenance and the finished marker ({@link StudyOutputs}).
     */
    public Outcome run(Plan plan, Options options) {
        Path out = options.out();
        OutputFolder.prepare(out, plan.study().name());
        Instant started = Instant.now();
        String studyText = StudyWriter.yaml(plan.study());
        FinishedIndex.Hashes hashes = FinishedIndex.Hashes.of(plan, studyText, versions);
        Outcome finished = alreadyFinished(plan, out, hashes);
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

        SessionPlan session;
        VersionLedger ledger;
        Provenance running;
        JournalRecorder recorder;
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
            OutputFolder.keepLearnersFile(out, recipe);
            running = new Provenance(Provenance.Build.current(),
                    new Provenance.Study(plan.study().name(), plan.hash(), hashes.study()),
                    new Provenance.Session(options.threads(), started, null, Map.of()),
                    new Provenance.Versions(versions, ledger));
            OutputFiles.write(out.resolve(PROVENANCE_FILE), running.json());
            session = SessionPlan.of(plan, existing, options.shuffle());
            say(options, journal, plan, session);
            options.progress().start(plan.runs().size(), session.reused());
            recorder = new JournalRecorder(journal, versions, options.progress(), session.kept());
            RunExecutor executor = engine.executor(options.threads(), simulator,
                    new RunPerformer(scorer, new SettingLayout(plan)));
            RunBatch.execute(executor, session.todo(), largestRows(plan), recorder);
        }
        options.progress().end();
        Map<RunStatus, Integer> byStatus = new StudyOutputs(aggregator).write(out, plan, recorder.inPlanOrder(plan),
                session, running, new StudyOutputs.Marker(hashes, !ledger.changes().isEmpty()));
        return new Outcome(new Outcome.Tally(plan.runs().size(), session.reused(), session.changed(),
                session.todo().size()), byStatus, out, false);
    }

    /**
     * The outcome of a session with nothing to do, when the folder's {@link FinishedIndex} matches
     * this plan, study text, versions and learners file; null when the journal must be read.
     */
    private Outcome alreadyFinished(Plan plan, Path out, FinishedIndex.Hashes hashes) {
        FinishedIndex index = FinishedIndex.read(out);
        if (index == null || index.total() != plan.runCount() || index.versionChanges() && !acceptVersionChange
                || !index.matches(out, hashes) || !OutputFolder.sameLearnersCopy(out, recipe)) {
            return null;
        }
        return new Outcome(new Outcome.Tally(index.total(), index.total(), 0, 0), index.byStatus(), out, true);
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

    private static void say(Options o, Journal journal, Plan plan, SessionPlan session) {
        PrintWriter w = o.messages();
        if (w == null) {
            return;
        }
        if (journal.hadTornLine()) {
            w.println("the journal's last line was torn (the previous session was interrupted while writing it);"
                    + " it was ignored and its run will be redone");
        }
        if (!journal.existing().isEmpty()) {
            w.printf(java.util.Locale.ROOT, "resuming in %s: %,d of %,d runs already done", o.out(), session.reused(),
                    plan.runs().size());
            if (session.changed() > 0) {
                w.printf(java.util.Locale.ROOT, "; %,d runs whose definition changed will be recomputed",
                        session.changed());
            }
            w.printf(java.util.Locale.ROOT, "; %,d to do%n", session.todo().size());
        }
        w.flush();
    }

    /** The copy of the learners file kept in a study's output folder, or null when there is none. */
    public static Path keptLearnersFile(Path out) {
        return OutputFolder.keptLearnersFile(out);
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

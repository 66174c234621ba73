package dev.touchstone.harness.study;

import java.util.List;

/**
 * The top-level fields of a study file: name, type, whether required, default and meaning.
 * The reader refuses any other key with this list, and the reference page is generated
 * from it, so the two cannot disagree.
 */
public final class StudyFields {

    /** One top-level field. */
    public record Field(String name, String type, boolean required, String defaultValue, String meaning) {
    }

    public static final String NAME = "name";
    public static final String DESCRIPTION = "description";
    public static final String SEED = "seed";
    public static final String REPLICATES = "replicates";
    public static final String TRUTH = "truth";
    public static final String SAMPLES = "samples";
    public static final String LEARNERS = "learners";
    public static final String METRICS = "metrics";
    public static final String LIMITS = "limits";
    public static final String COMPARE_TO = "compare_to";
    public static final String SCORE_AGAINST = "score_against";

    /** Keys of a learner entry. */
    public static final String ENTRY_ID = "id";
    public static final String ENTRY_USE = "use";
    public static final String ENTRY_WITH = "with";
    public static final String ENTRY_KNOWLEDGE = "knowledge";
    public static final String ENTRY_STEPS = "steps";

    /** Key of a composed entry's step besides {@code use} and {@code with}: how it receives the step before's estimate. */
    public static final String STEP_GIVEN = "given";

    /** Keys of {@code limits}. */
    public static final String LIMIT_SECONDS = "seconds";
    public static final String LIMIT_MAX_RUNS = "max_runs";

    /** The largest number of replicates and the smallest sample size accepted. */
    public static final int MAX_REPLICATES = 100_000;
    public static final int MIN_SAMPLES = 2;

    public static final List<Field> TOP_LEVEL = List.of(
            new Field(NAME, "text", true, null,
                    "A short name for the study: letters, digits, '.', '_' and '-'."),
            new Field(DESCRIPTION, "text", false, "empty", "What the study is for, in a sentence or two."),
            new Field(SEED, "integer", true, null,
                    "The root of every random choice; each draw's seed derives from it and the draw's coordinates."),
            new Field(REPLICATES, "integer", false, "1",
                    "Independent draws of graph, parameters and data per setting, 1 to " + MAX_REPLICATES + "."),
            new Field(TRUTH, "map or list of maps", true, null,
                    "What to simulate: one sub-section per part of the truth (see below). A list of values expands into a grid;"
                            + " a list of such maps runs several grids side by side."),
            new Field(SAMPLES, "list", true, null,
                    "Sample sizes: whole numbers of at least " + MIN_SAMPLES + ", and/or `oracle` (infinite sample)."),
            new Field(LEARNERS, "list", true, null,
                    "Learner entries: `{id: NAME, use: LEARNER, with: {PARAMETER: VALUE or [VALUES]}}`, or just a learner id;"
                            + " `{id: NAME, steps: [...]}` composes learners (see below)."),
            new Field(METRICS, "list", false, "the default metrics",
                    "Metric names to compute for every run."),
            new Field(LIMITS, "map", false, "no time limit; max_runs " + Limits.DEFAULT_MAX_RUNS,
                    "`seconds`: time limit of one run; `max_runs`: largest grid accepted."),
            new Field(COMPARE_TO, "text", false, "none",
                    "The id of the learner entry every other is compared with (paired, per setting and metric)."),
            new Field(SCORE_AGAINST, "list", false, "none",
                    "Extra truths to score every estimate against, besides the one of its own class: any of dag,"
                            + " cpdag, mag, pag. Each adds the columns METRIC_vs_CLASS (e.g. shd_vs_cpdag) for every"
                            + " structural metric; undefined (empty) where that truth does not exist, such as a DAG"
                            + " or CPDAG when variables are hidden."));

    private StudyFields() {
    }

    /** The names of the top-level fields, for "allowed: …" messages. */
    public static List<String> names() {
        return TOP_LEVEL.stream().map(Field::name).toList();
    }
}

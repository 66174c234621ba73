package dev.touchstone.harness.study;

import java.util.ArrayList;
import java.util.List;

/**
 * An expanded study: its truth settings, learner configurations and runs in their fixed
 * order — truth setting, then replicate, then sample size, then configuration — so a
 * replicate's runs are contiguous and its data can be generated once and dropped soon.
 * Everything a runner, a resume or a report needs. Immutable.
 *
 * <p>The runs (one {@link RunDefinition} and one SHA-256 key each) are built on first use, since
 * a resume of a finished study needs only their number and the {@link #outlineHash()}: for a
 * study of 10,000 runs building them is most of the cost of that resume.
 */
public final class Plan {

    private final Study study;
    private final List<TruthSetting> truths;
    private final List<LearnerConfig> configs;
    private volatile List<RunDefinition> runs;

    /** The plan of a validated study with these truth settings and configurations (runs built when first asked for). */
    public Plan(Study study, List<TruthSetting> truths, List<LearnerConfig> configs) {
        this.study = java.util.Objects.requireNonNull(study, "study");
        this.truths = List.copyOf(truths);
        this.configs = List.copyOf(configs);
    }

    /** The study expanded. */
    public Study study() {
        return study;
    }

    /** The truth settings, in expansion order. */
    public List<TruthSetting> truths() {
        return truths;
    }

    /** The learner configurations, in expansion order. */
    public List<LearnerConfig> configs() {
        return configs;
    }

    /** Every run, in the fixed order (built once, on the first call). */
    public List<RunDefinition> runs() {
        List<RunDefinition> r = runs;
        if (r == null) {
            synchronized (this) {
                r = runs;
                if (r == null) {
                    r = build();
                    runs = r;
                }
            }
        }
        return r;
    }

    /** Whether the runs have been built (a resume of a finished study, for one, does not build them). */
    public boolean runsBuilt() {
        return runs != null;
    }

    private List<RunDefinition> build() {
        List<RunDefinition> out = new ArrayList<>(runCount());
        for (TruthSetting t : truths) {
            for (int rep = 0; rep < study.replicates(); rep++) {
                for (SampleSize n : study.samples()) {
                    for (LearnerConfig c : configs) {
                        out.add(RunDefinition.builder().index(out.size()).truth(t).replicate(rep).sample(n)
                                .config(c).studySeed(study.seed()).metrics(study.allMetrics())
                                .limit(study.limits().perRun()).build());
                    }
                }
            }
        }
        return List.copyOf(out);
    }

    /** The number of runs, without building them. */
    public int runCount() {
        return Math.toIntExact((long) truths.size() * study.replicates() * study.samples().size() * configs.size());
    }

    /** The number of settings (truth settings × sample sizes). */
    public int settingCount() {
        return truths.size() * study.samples().size();
    }

    /** The number of replicates whose data must be generated. */
    public int replicateCount() {
        return truths.size() * study.replicates();
    }

    /** The configuration of the reference learner ({@code compare_to}), or null. */
    public LearnerConfig reference() {
        if (study.compareTo() == null) {
            return null;
        }
        for (LearnerConfig c : configs) {
            if (c.entryId().equals(study.compareTo())) {
                return c;
            }
        }
        return null;
    }

    /** A hash of every run's key, in order: equal for two studies that define exactly the same runs. */
    public String hash() {
        StringBuilder sb = new StringBuilder();
        for (RunDefinition r : runs()) {
            sb.append(r.key()).append('\n');
        }
        return Canonical.hash(sb.toString());
    }

    /**
     * A hash of everything the runs are made of, without making them: equal outline hashes mean
     * the same runs, hence the same {@link #hash()}.
     *
     * <p>Why that holds: {@link #build} is the only place runs are made, and a run is its
     * position in the fixed loop over truth settings, replicates, sample sizes and configurations,
     * with a key that {@link RunDefinition#definition} computes from the study seed, the truth
     * setting's canonical text, the replicate number, the sample size's word, the configuration's
     * canonical text, the metrics (score-against ones included) and the per-run limit. The outline
     * text holds each of those inputs, each list in order and every text with its length in front,
     * so two different outlines cannot be the same text. Note that the normalised study text and
     * the versions alone would not do: a run's key also holds the digest of a given graph file and
     * a command learner's command line (both outside the study text), and parameter defaults
     * declared in code, which a build keeping its version label could change; the canonical texts
     * here include all three.
     */
    public String outlineHash() {
        StringBuilder sb = new StringBuilder("outline/v1");
        field(sb, "seed", Long.toString(study.seed()));
        field(sb, "replicates", Integer.toString(study.replicates()));
        for (TruthSetting t : truths) {
            field(sb, "truth", t.canonical());
        }
        for (SampleSize n : study.samples()) {
            field(sb, "samples", n.word());
        }
        for (LearnerConfig c : configs) {
            field(sb, "learner", c.canonical());
        }
        for (String m : study.allMetrics()) {
            field(sb, "metric", m);
        }
        field(sb, "limit", study.limits().perRun() == null ? "none" : study.limits().perRun().toMillis() + "ms");
        return Canonical.hash(sb.toString());
    }

    private static void field(StringBuilder sb, String name, String text) {
        sb.append('|').append(name).append('=').append(text.length()).append(':').append(text);
    }
}

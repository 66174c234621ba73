package dev.touchstone.harness.study;

import dev.touchstone.core.param.ParameterSpec;

import java.util.List;

/**
 * Generates the reference page for study files (docs/study-files.md) from the same
 * descriptors the reader validates with: {@link StudyFields}, the truth catalogue's
 * sections, kinds and {@code ParameterSpec}s, and the metric catalogue. A test regenerates
 * the page and fails when the committed one is stale.
 */
public final class StudyReference {

    private StudyReference() {
    }

    public static String markdown(TruthCatalog truth, MetricCatalog metrics) {
        StringBuilder sb = new StringBuilder();
        sb.append("# Study files\n\n")
                .append("<!-- Generated from the code's descriptors by StudyReferenceTest; do not edit by hand.\n")
                .append("     Regenerate with: mvn -pl harness -am verify -Dtest=StudyReferenceTest")
                .append(" -Dsurefire.failIfNoSpecifiedTests=false -Dtouchstone.regenerateDocs=true -->\n\n")
                .append("A study file (YAML, or JSON with a `.json` name) says what to simulate, which learners to run")
                .append(" with which parameter values, which metrics to compute and how many replicates to draw.")
                .append(" Wherever a value may be a list, a list expands into an axis of the grid: the study runs")
                .append(" every combination. The file is checked completely before anything runs; every problem is")
                .append(" reported at once, each as one line `FILE:LINE:COLUMN: FIELD: what is wrong (allowed: …)`.")
                .append(" `touchstone check STUDY` prints the grid, the work it implies and its wall time estimated")
                .append(" by a short pilot (`--no-pilot` to skip it) without running.\n\n")
                .append("```yaml\n")
                .append("name: sparse-linear\n")
                .append("description: how PC-like searches fare on sparse linear Gaussian graphs\n")
                .append("seed: 42\nreplicates: 10\ntruth:\n")
                .append("  graph: {family: erdos-renyi, nodes: [20, 50], mean_degree: [2, 4]}\n")
                .append("  model: {kind: linear-gaussian}\n")
                .append("  hidden: 0\n")
                .append("samples: [100, 1000, oracle]\n")
                .append("learners:\n")
                .append("  - {id: mine, use: my-method, with: {threshold: [0.2, 0.4]}}\n")
                .append("  - {id: baseline, use: some-learner}\n")
                .append("metrics: [shd, adjacency_f1, orientation_f1, seconds]\n")
                .append("limits: {seconds: 120}\n")
                .append("compare_to: baseline\n```\n\n");
        sb.append("## Top-level fields\n\n| field | type | required | default | meaning |\n|---|---|---|---|---|\n");
        for (StudyFields.Field f : StudyFields.TOP_LEVEL) {
            sb.append("| `").append(f.name()).append("` | ").append(f.type()).append(" | ")
                    .append(f.required() ? "yes" : "no").append(" | ")
                    .append(f.defaultValue() == null ? "" : f.defaultValue()).append(" | ")
                    .append(cell(f.meaning())).append(" |\n");
        }
        sb.append("\n## Learner entries\n\n")
                .append("Each entry of `learners` is `{id: NAME, use: LEARNER, with: {PARAMETER: VALUE}}`, or just a")
                .append(" learner id. `use` names a learner from `touchstone learners` (built in, from a plug-in jar")
                .append(" given with `--plugins DIR`, or an external command declared in a learners file given with")
                .append(" `--learners FILE`; a study file alone can never make a command runnable). `id` is the")
                .append(" entry's name in results (default: the learner id) and must be unique. Each parameter in")
                .append(" `with` takes one value or a list; a list makes one configuration per value, named")
                .append(" `id[parameter=value]`. Parameters and their ranges are those the learner declares.")
                .append(" `knowledge: tiers` hands the runs the tiers the truth comes with (the layers of the")
                .append(" `layered` graph family, over the observed variables) as background knowledge; the learner")
                .append(" must honour tiers (see `touchstone learners`), and truths without tiers give no knowledge.")
                .append(" The default, `knowledge: none`, gives none.")
                .append(" Two entries with the same learner and values are refused.\n\n")
                .append("### Composed learners\n\n")
                .append("An entry `{id: NAME, steps: [STEP, STEP, ...], knowledge: ...}` is one learner made of two or")
                .append(" more steps run in order on the same data. Each step is `{use: LEARNER, with: {...}}` as above;")
                .append(" every step after the first also says, with `given`, how it receives the estimate of the")
                .append(" step before: `allowed-edges` (only that estimate's adjacencies may be edges: every other")
                .append(" pair is forbidden both ways; the learner must honour forbidden edges), `required-edges` (its")
                .append(" edges are required; the step before must return a dag, since knowledge can require only")
                .append(" directed edges, and the learner must honour required edges) or `start-graph` (the search")
                .append(" starts from that estimate; the learner must say it can, see `touchstone learners`). For")
                .append(" example `{id: pc-hc, steps: [{use: pc, with: {alpha: 0.01}}, {use: hill-climbing, given:")
                .append(" allowed-edges}]}` searches DAGs within PC's skeleton. Any learner can be a step, outside")
                .append(" commands included. The composed learner's id joins the steps' ids with `-then-` (e.g.")
                .append(" `pc-then-hill-climbing`), and its parameters are the steps' own, named `STEP.PARAMETER`")
                .append(" (`pc.alpha`; a learner used twice is `hill-climbing-2` the second time); a list of values in")
                .append(" a step's `with` expands as usual, into configurations named e.g. `pc-hc[pc.alpha=0.01]`.")
                .append(" What it accepts is derived from the steps: the data kinds all accept, the last step's")
                .append(" graph class, missing values refused if any step refuses them, the knowledge all honour")
                .append(" (so `knowledge: tiers` needs every step to honour tiers, and every step receives them), and")
                .append(" the oracle only when every step can use it. Its runs are scored like any learner's; their")
                .append(" time and test and score counts are the sums over the steps.\n\n");
        sb.append("## Sample sizes\n\n")
                .append("`samples` lists whole numbers of at least ").append(StudyFields.MIN_SAMPLES)
                .append(", and/or `oracle`. Within a replicate the graph and parameters are shared by all sample")
                .append(" sizes and smaller data sets are prefixes of the largest one. With `oracle`, learners that")
                .append(" declare an oracle use get d-separation answers or the exact population covariance; the")
                .append(" others are recorded `skipped` with the reason.\n\n");
        sb.append("## Limits\n\n")
                .append("`limits.seconds` is the time limit of one run (cooperative deadline for Java learners; the")
                .append(" whole process tree is killed for external commands); a run over it is recorded `timeout`.")
                .append(" `limits.max_runs` (default ").append(Limits.DEFAULT_MAX_RUNS)
                .append(") refuses grids larger than this, saying how large the grid is.\n\n");
        sb.append("## Truth\n\n")
                .append("`truth` has one sub-section per part of the simulation. Each is a map naming its kind and")
                .append(" giving parameter values; a grouped value such as `edge_weight: {low: 0.5, high: 2}` means")
                .append(" the parameters `edge_weight_low` and `edge_weight_high`. The kind itself may be a list")
                .append(" (every listed kind must then accept every parameter given).\n\n")
                .append("`truth` may also be a list of such maps (blocks). Each block expands into its own grid and")
                .append(" the study runs the settings of all blocks side by side, for example random graphs and a")
                .append(" named network:\n\n```yaml\ntruth:\n  - graph: {family: erdos-renyi, nodes: [8, 16]}\n")
                .append("    model: {kind: linear-gaussian}\n  - network: community-garden\n```\n\n")
                .append("A path in a study file (the `file` of the `given` graph family) is read relative to the")
                .append(" study file's folder; the normalised `study.yaml` of a study's output names it absolutely,")
                .append(" and run keys and seeds include a digest of the file's bytes instead of its path, so editing")
                .append(" the graph file recomputes its runs on resume, while moving the study and its graph to another")
                .append(" folder keeps them.\n\n");
        for (TruthCatalog.Section s : truth.sections()) {
            sb.append("### `truth.").append(s.name()).append("`\n\n").append(s.meaning()).append(" The kind is named by `")
                    .append(s.kindField()).append("`");
            if (s.defaultKind() != null) {
                sb.append("; when the section is left out it is `").append(s.defaultKind()).append("`");
            } else if (s.optional()) {
                sb.append("; when it is given, `").append(String.join("` and `", s.replaces()))
                        .append("` must be left out");
            } else {
                sb.append("; the section is required").append(replacedBy(truth, s.name()));
            }
            if (s.bareValueIsKind()) {
                sb.append(". A bare name or list of names means `{").append(s.kindField()).append(": NAME}`");
            } else if (s.shorthand() != null) {
                sb.append(". A bare value or list means `{").append(s.kindField()).append(": ").append(s.shorthandKind())
                        .append(", ").append(s.shorthand()).append(": VALUE}`");
            }
            sb.append(".\n\n");
            for (TruthCatalog.Kind k : s.kinds()) {
                sb.append("**`").append(k.name()).append("`**: ").append(cell(k.summary())).append("\n\n");
                parameters(sb, k.parameters());
            }
        }
        sb.append("## Metrics\n\n| metric | meaning |\n|---|---|\n");
        for (String m : metrics.names()) {
            sb.append("| `").append(m).append("` | ").append(cell(metrics.meaning(m))).append(" |\n");
        }
        sb.append("\nDefault when `metrics` is left out: ").append(String.join(", ", metrics.defaults())).append(".\n");
        return sb.toString();
    }

    private static String replacedBy(TruthCatalog truth, String section) {
        List<String> by = new java.util.ArrayList<>();
        for (TruthCatalog.Section other : truth.sections()) {
            if (other.replaces().contains(section)) {
                by.add("`" + other.name() + "`");
            }
        }
        return by.isEmpty() ? "" : " unless " + String.join(" or ", by) + " is given";
    }

    private static void parameters(StringBuilder sb, List<ParameterSpec> ps) {
        if (ps.isEmpty()) {
            sb.append("No parameters.\n\n");
            return;
        }
        sb.append("| parameter | type | default | allowed | meaning |\n|---|---|---|---|---|\n");
        for (ParameterSpec p : ps) {
            sb.append("| `").append(p.name()).append("` | ").append(p.type().word()).append(" | ")
                    .append(p.defaultValue() == null ? "required" : Canonical.value(p.defaultValue())).append(" | ")
                    .append(cell(p.allowed())).append(" | ").append(cell(p.meaning())).append(" |\n");
        }
        sb.append('\n');
    }

    private static String cell(String s) {
        return s == null ? "" : s.replace("|", "\\|").replace("\n", " ");
    }
}

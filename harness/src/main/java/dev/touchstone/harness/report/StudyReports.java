package dev.touchstone.harness.report;

import dev.touchstone.core.graph.Graph;
import dev.touchstone.core.learner.Estimate;
import dev.touchstone.generators.audit.SortabilityAudit;
import dev.touchstone.harness.execution.Aggregator;
import dev.touchstone.harness.execution.Replicate;
import dev.touchstone.harness.execution.SettingLayout;
import dev.touchstone.harness.execution.Simulator;
import dev.touchstone.harness.execution.StudyRunner;
import dev.touchstone.harness.io.AtomicFiles;
import dev.touchstone.harness.study.ComponentSpec;
import dev.touchstone.harness.study.LearnerConfig;
import dev.touchstone.harness.study.Plan;
import dev.touchstone.harness.study.RunDefinition;
import dev.touchstone.harness.study.TruthSetting;
import dev.touchstone.metrics.against.MetricAgainst;
import dev.touchstone.metrics.aggregate.Summaries;
import dev.touchstone.metrics.rank.Ranking;
import dev.touchstone.metrics.results.RankingResult;
import dev.touchstone.metrics.results.RunResult;
import dev.touchstone.metrics.results.Setting;
import dev.touchstone.metrics.scoring.Direction;
import dev.touchstone.metrics.scoring.Metric;
import dev.touchstone.metrics.truth.TruthSelection;
import dev.touchstone.reports.HtmlReport;
import dev.touchstone.reports.MarkdownReport;
import dev.touchstone.reports.ReportArtifacts;
import dev.touchstone.reports.ReportData;
import dev.touchstone.reports.tables.LatexTable;
import dev.touchstone.reports.tables.MarkdownTable;
import dev.touchstone.reports.tables.Table;
import dev.touchstone.core.random.Seeds;

import java.io.IOException;
import java.io.UncheckedIOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.HashSet;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.Set;

/**
 * Gathers a study's report data from its plan and the runs recorded so far, and writes
 * {@code report.html} and {@code report.md} in the output folder, each whole or not at all.
 *
 * <p>Aggregates, comparisons and rankings come from the metrics module, seeded from the
 * study seed, so a report re-rendered later shows the same numbers. The sortability audit
 * needs the data, which the journal does not keep: it re-draws replicate 0 of each setting
 * (deterministic, from the same seeds). The graph pictures show the estimates kept beside the
 * journal ({@code estimates.jsonl}) for replicate 0 of the first setting, against its true
 * graph; no learner is ever run again, so a report needs neither the learners nor their files.
 */
public final class StudyReports {

    /** The report's HTML page in the folder it is written to. */
    public static final String HTML_FILE = "report.html";
    /** The report's Markdown page beside it. */
    public static final String MARKDOWN_FILE = "report.md";
    /** Both pages (the figures and tables are written after them). */
    public static final List<String> PAGES = List.of(HTML_FILE, MARKDOWN_FILE);

    /** Settings whose replicate 0 is re-drawn for the audit, at most. */
    static final int AUDITED_SETTINGS = 24;
    /** Learner configurations pictured, at most. */
    static final int PICTURED_CONFIGURATIONS = 6;
    /** Variables a picture may have; larger graphs are not drawn (they would not be readable). */
    static final int PICTURE_VARIABLES = 40;
    /** Learner ids of the scale-artefact baselines, for the audit's warning. */
    public static final Set<String> SCALE_BASELINES = Set.of("variance-sort-regress", "r2-sort-regress");

    private StudyReports() {
    }

    /**
     * The truth sections that tell a study's truth blocks apart (those some block leaves
     * out, such as {@code graph} and {@code network}); the headline gets one table per
     * block through them. Empty for a study with one block.
     */
    static List<String> blockSections(Plan plan) {
        List<List<ComponentSpec>> blocks = plan.study().truths();
        if (blocks.size() < 2) {
            return List.of();
        }
        java.util.Set<String> all = new java.util.LinkedHashSet<>();
        for (List<ComponentSpec> block : blocks) {
            block.forEach(c -> all.add(c.section()));
        }
        List<String> out = new ArrayList<>();
        for (String section : all) {
            if (!blocks.stream().allMatch(b -> b.stream().anyMatch(c -> c.section().equals(section)))) {
                out.add(section);
            }
        }
        return out;
    }

    /**
     * The report data of a study.
     *
     * @param runs    the recorded runs in plan order (fewer than the plan's when partial)
     * @param partial whether the study is unfinished
     * @param estimates the kept estimates by run key (runs without one are not pictured)
     */
    public static ReportData gather(Plan plan, List<RunResult> runs, boolean partial, Simulator simulator,
                                    Aggregator aggregator, Map<String, String> provenance,
                                    Map<String, Estimate> estimates) {
        long statsSeed = Seeds.derive(plan.study().seed(), "statistics");
        List<String> metrics = plan.study().allMetrics();
        ReportData.Builder b = ReportData.builder(plan.study().name())
                .description(plan.study().description())
                .partial(partial)
                .metrics(metrics)
                .runs(runs)
                .summary(aggregator.summarise(runs, metrics, statsSeed))
                .provenance(provenance)
                .scaleBaselines(SCALE_BASELINES)
                .coordinates(SettingLayout.SAMPLES, "nodes")
                .groupBy(blockSections(plan))
                .summarizer(values -> Summaries.of(values.stream().mapToDouble(Double::doubleValue).toArray(),
                        Seeds.random(Seeds.derive(statsSeed, "pooled"))));
        for (String m : metrics) {
            MetricAgainst.find(m).map(Metric::direction).filter(d -> d != Direction.NONE)
                    .ifPresent(d -> b.direction(m, d == Direction.HIGHER_IS_BETTER));
        }
        if (plan.reference() != null) {
            String ref = plan.reference().label();
            b.reference(ref).comparisons(aggregator.compare(runs, metrics, ref, statsSeed));
        }
        List<RankingResult> rankings = new ArrayList<>();
        for (String m : metrics) {
            Metric metric = MetricAgainst.find(m).orElse(null);
            if (metric != null && metric.direction() != Direction.NONE && !m.equals("seconds")) {
                rankings.add(Ranking.over(runs, m, 0.05));
            }
        }
        b.rankings(rankings);
        redraw(plan, simulator, estimates, b, runs);
        return b.build();
    }

    private static void redraw(Plan plan, Simulator simulator, Map<String, Estimate> estimates,
                               ReportData.Builder b, List<RunResult> recorded) {
        SettingLayout layout = new SettingLayout(plan);
        int rows = StudyRunner.largestRows(plan);
        List<ReportData.Audit> audits = new ArrayList<>();
        List<ReportData.Example> examples = new ArrayList<>();
        Set<Integer> auditedTruths = new HashSet<>();
        Set<String> auditedSettings = new HashSet<>();
        Map<Integer, Replicate> drawn = new LinkedHashMap<>();
        Set<String> pictured = new HashSet<>();
        Integer picturedTruth = null;
        for (RunDefinition run : plan.runs()) {
            if (run.replicate() != 0) {
                continue;
            }
            TruthSetting truth = run.truth();
            Replicate rep = drawn.get(truth.index());
            if (rep == null && drawn.size() < AUDITED_SETTINGS) {
                try {
                    rep = simulator.draw(truth, run.seeds(), rows);
                } catch (RuntimeException e) {
                    continue;
                }
                drawn.put(truth.index(), rep);
            }
            if (rep == null) {
                continue;
            }
            Setting setting = layout.setting(run);
            if (!run.sample().isOracle() && rep.data() != null && auditedSettings.add(setting.label())
                    && auditedTruths.add(truth.index())) {
                SortabilityAudit a = SortabilityAudit.of(rep.trueDag(), rep.data().head(run.sample().intRows()));
                audits.add(new ReportData.Audit(setting, finite(a.varsortability()), finite(a.r2Sortability())));
            }
            if (picturedTruth == null) {
                picturedTruth = truth.index();
            }
            LearnerConfig config = run.config();
            if (truth.index() == picturedTruth && !run.sample().isOracle() && pictured.size() < PICTURED_CONFIGURATIONS
                    && rep.trueDag().size() <= PICTURE_VARIABLES && !pictured.contains(config.label())) {
                Estimate e = estimates.get(run.key());
                if (e != null) {
                    pictured.add(config.label());
                    // Name and draw the truth class the run was scored against (runs.csv), which for a
                    // PAG study is the PAG even when the estimate's own class would suggest another.
                    dev.touchstone.core.graph.GraphClass scored = scoredAgainst(recorded, run);
                    dev.touchstone.core.graph.GraphClass truthClass = scored == null ? e.graphClass() : scored;
                    Graph truthGraph = TruthSelection.forEstimate(rep.trueDag(), truthClass).reference();
                    examples.add(new ReportData.Example(config.label() + " on " + setting.label() + ", replicate 0"
                            + " (scored against the true " + truthClass.word().toUpperCase(java.util.Locale.ROOT)
                            + ")", truthGraph, e.graph()));
                }
            }
        }
        b.audits(audits).examples(examples).pictureRule("Pictured: replicate 0 of the first setting in the plan"
                + " whose truth has at most " + PICTURE_VARIABLES + " variables, for each of the first "
                + PICTURED_CONFIGURATIONS + " learner configurations in the study's order that ran ok on it (sample"
                + " data, not an oracle); each estimate is drawn against the truth of the class its run was scored"
                + " against.");
    }

    /** The class of truth a recorded run was scored against, or null when it is not recorded. */
    private static dev.touchstone.core.graph.GraphClass scoredAgainst(List<RunResult> runs, RunDefinition run) {
        for (RunResult r : runs) {
            if (r.key().equals(run.key())) {
                return r.scoredAgainst();
            }
        }
        return null;
    }

    private static Double finite(double v) {
        return Double.isFinite(v) ? v : null;
    }

    /**
     * Writes report.html and report.md into {@code folder}, and beside them every chart as a
     * standalone SVG file and a one-page PDF in {@code figures/} and every table as Markdown and LaTeX (booktabs)
     * in {@code tables/}, for a paper to include as they are; returns the HTML file.
     */
    public static Path write(Path folder, ReportData data) {
        try {
            Files.createDirectories(folder);
            Path html = folder.resolve(HTML_FILE);
            ReportArtifacts artifacts = HtmlReport.build(data);
            AtomicFiles.writeString(html, artifacts.html());
            AtomicFiles.writeString(folder.resolve(MARKDOWN_FILE), MarkdownReport.render(data));
            Path figures = Files.createDirectories(folder.resolve("figures"));
            for (Map.Entry<String, ReportArtifacts.Chart> f : artifacts.figures().entrySet()) {
                AtomicFiles.writeString(figures.resolve(f.getKey() + ".svg"), f.getValue().svgFile());
                byte[] pdf = f.getValue().pdfFile();
                AtomicFiles.writeBytes(figures.resolve(f.getKey() + ".pdf"), out -> out.write(pdf));
            }
            Path tables = Files.createDirectories(folder.resolve("tables"));
            for (Map.Entry<String, Table> t : artifacts.tables().entrySet()) {
                AtomicFiles.writeString(tables.resolve(t.getKey() + ".md"), MarkdownTable.render(t.getValue()));
                AtomicFiles.writeString(tables.resolve(t.getKey() + ".tex"), LatexTable.render(t.getValue()));
            }
            return html;
        } catch (IOException e) {
            throw new UncheckedIOException("cannot write the report into " + folder + ": " + e.getMessage(), e);
        }
    }
}

package dev.touchstone.harness.reproductions;

import dev.touchstone.core.random.Seeds;
import dev.touchstone.harness.catalog.LearnerCatalog;
import dev.touchstone.harness.execution.GeneratorSimulator;
import dev.touchstone.harness.execution.Journal;
import dev.touchstone.harness.execution.JournalCodec;
import dev.touchstone.harness.execution.MetricsAggregator;
import dev.touchstone.harness.execution.MetricsScorer;
import dev.touchstone.harness.execution.Progress;
import dev.touchstone.harness.execution.StudyRunner;
import dev.touchstone.harness.study.Expansion;
import dev.touchstone.harness.study.GeneratorTruthCatalog;
import dev.touchstone.harness.study.Plan;
import dev.touchstone.harness.study.RegistryMetricCatalog;
import dev.touchstone.harness.study.RunDefinition;
import dev.touchstone.harness.study.StudyReader;
import dev.touchstone.metrics.compare.PairedComparison;
import dev.touchstone.metrics.results.ComparisonRow;
import dev.touchstone.metrics.results.RunResult;
import dev.touchstone.metrics.results.Setting;

import java.io.IOException;
import java.io.UncheckedIOException;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.function.Predicate;

/**
 * A bundled study of {@code scenarios/reproductions/} run in-process as {@code touchstone run}
 * runs it (same reader, expansion, simulator, scorer and runner), with its results read back
 * from the journal in plan order.
 */
final class BundledStudy {

    /** The folder of the bundled reproductions, from the harness module's working directory. */
    static final Path FOLDER = Path.of("..").toAbsolutePath().normalize().resolve("scenarios/reproductions");

    final Plan plan;
    final List<RunResult> runs;

    private BundledStudy(Plan plan, List<RunResult> runs) {
        this.plan = plan;
        this.runs = runs;
    }

    static Plan plan(Path file) {
        GeneratorTruthCatalog truth = new GeneratorTruthCatalog();
        LearnerCatalog learners = LearnerCatalog.builtIn();
        return new Expansion(truth).expand(new StudyReader(truth, learners, new RegistryMetricCatalog()).read(file),
                learners);
    }

    /** Runs {@code scenarios/reproductions/NAME.yaml} on two threads into {@code out}. */
    static BundledStudy run(String name, Path out) {
        Plan plan = plan(FOLDER.resolve(name + ".yaml"));
        new StudyRunner(new GeneratorSimulator(), new MetricsScorer(), new MetricsAggregator())
                .run(plan, new StudyRunner.Options(out, 2, Progress.quiet(), null));
        Map<String, JournalCodec.Line> lines;
        try {
            lines = Journal.read(out.resolve(Journal.FILE_NAME)).lines();
        } catch (IOException e) {
            throw new UncheckedIOException(e);
        }
        List<RunResult> runs = new ArrayList<>();
        for (RunDefinition r : plan.runs()) {
            runs.add(lines.get(r.key()).result());
        }
        return new BundledStudy(plan, runs);
    }

    /** The runs whose setting has every given coordinate value (name, value, name, value, …). */
    List<RunResult> where(String... namesAndValues) {
        Setting wanted = Setting.of(namesAndValues);
        Predicate<RunResult> p = r -> wanted.coordinates().entrySet().stream()
                .allMatch(e -> e.getValue().equals(r.setting().get(e.getKey())));
        return runs.stream().filter(p).toList();
    }

    /** The mean of a metric over the ok runs of a configuration among {@code runs} (defined values only). */
    static double mean(List<RunResult> runs, String configuration, String metric) {
        return runs.stream().filter(r -> r.configurationId().equals(configuration))
                .map(r -> r.value(metric)).filter(v -> v != null).mapToDouble(Double::doubleValue).average()
                .orElseThrow(() -> new AssertionError("no value of " + metric + " for " + configuration));
    }

    /**
     * The paired comparison (metrics.compare: mean difference, Wilcoxon signed-rank, wins) of
     * {@code configuration} against {@code reference} on one metric, over {@code runs} of one setting.
     */
    ComparisonRow compare(List<RunResult> runs, String configuration, String reference, String metric) {
        List<ComparisonRow> rows = PairedComparison.compare(runs, reference, List.of(metric),
                Seeds.derive(plan.study().seed(), "statistics"));
        List<ComparisonRow> mine = rows.stream().filter(r -> r.configurationId().equals(configuration)).toList();
        if (mine.size() != 1) {
            throw new AssertionError("expected one comparison row of " + configuration + ", got " + mine);
        }
        return mine.get(0);
    }

    /**
     * Asserts a significant paired difference {@code configuration − reference} in the given direction
     * (sign +1: larger, −1: smaller) at the 5% level, and returns the comparison row.
     */
    ComparisonRow assertShift(List<RunResult> runs, String configuration, String reference, String metric, int sign) {
        ComparisonRow c = compare(runs, configuration, reference, metric);
        if (!(Math.signum(c.meanDifference()) == sign && c.pValue() != null && c.pValue() < 0.05)) {
            throw new AssertionError(metric + ", " + configuration + " − " + reference + ": expected a significant "
                    + (sign > 0 ? "increase" : "decrease") + ", got " + c);
        }
        return c;
    }

    /**
     * Pairs one configuration with itself across a coordinate of the grid (sample size, standardisation,
     * missingness mechanism …): each run is relabelled {@code configuration@axis=value} and the axis is dropped
     * from its setting. Valid as a paired design because settings that differ only in such an axis share the
     * replicate's graph and draw (docs/dev/harness.md, "Seeds").
     */
    static List<RunResult> acrossAxis(List<RunResult> runs, String configuration, String axis) {
        List<RunResult> out = new ArrayList<>();
        for (RunResult r : runs) {
            if (!r.configurationId().equals(configuration)) {
                continue;
            }
            Map<String, String> coordinates = new LinkedHashMap<>(r.setting().coordinates());
            String value = coordinates.remove(axis);
            out.add(r.toBuilder().setting(new Setting(coordinates))
                    .configurationId(label(configuration, axis, value)).build());
        }
        return out;
    }

    /**
     * The runs with one coordinate dropped, pooling its settings as further replicates (replicate
     * {@code r} of the k-th value becomes {@code r · 1000 + k}), so that a paired comparison runs over
     * all of them at once.
     */
    static List<RunResult> pooledOver(List<RunResult> runs, String axis) {
        List<String> values = runs.stream().map(r -> r.setting().get(axis)).distinct().toList();
        List<RunResult> out = new ArrayList<>();
        for (RunResult r : runs) {
            Map<String, String> coordinates = new LinkedHashMap<>(r.setting().coordinates());
            int k = values.indexOf(coordinates.remove(axis));
            out.add(r.toBuilder().setting(new Setting(coordinates)).replicate(r.replicate() * 1000 + k).build());
        }
        return out;
    }

    static String label(String configuration, String axis, String value) {
        return configuration + "@" + axis + "=" + value;
    }
}

package dev.touchstone.metrics.compare;

import dev.touchstone.core.random.Seeds;
import dev.touchstone.metrics.aggregate.Bootstrap;
import dev.touchstone.metrics.aggregate.Summaries;
import dev.touchstone.metrics.results.ComparisonRow;
import dev.touchstone.metrics.results.RunResult;
import dev.touchstone.metrics.results.Setting;
import dev.touchstone.metrics.scoring.Direction;
import dev.touchstone.metrics.scoring.Metric;
import dev.touchstone.metrics.against.MetricAgainst;

import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.LinkedHashSet;
import java.util.List;
import java.util.Map;
import java.util.Objects;
import java.util.Set;
import java.util.TreeMap;

/**
 * Compares every learner configuration with a reference configuration, setting by setting and
 * metric by metric, over the replicates where both ran ok on the identical data set.
 *
 * <p>For each pair of runs the difference is {@code configuration − reference}. The row gives
 * the mean difference with a seeded percentile bootstrap 95% interval, the two-sided Wilcoxon
 * signed-rank p-value (Wilcoxon 1945) of {@link SignedRankTest}, which ranks zero differences
 * and then leaves them out of the statistic (Pratt 1959) and uses the exact conditional null
 * distribution, ties and zeros included, up to {@value SignedRankTest#EXACT_LIMIT} pairs; then the
 * Holm adjustment across the configurations compared on the same setting and metric; and wins,
 * ties and losses by the metric's direction. A row whose differences are all zero has no
 * p-value (null): there is nothing to test.
 *
 * <p>Cost: O(runs + rows · (resamples + replicates log replicates)).
 */
public final class PairedComparison {

    private PairedComparison() {
    }

    /**
     * The comparison rows, ordered by setting (first appearance), metric (as listed), then
     * configuration (first appearance).
     *
     * @param referenceId the configuration everything is compared with; it must appear in the runs
     * @param seed        the study seed, from which each interval's seed is derived by coordinates
     */
    public static List<ComparisonRow> compare(List<RunResult> runs, String referenceId, List<String> metrics, long seed) {
        Objects.requireNonNull(referenceId, "referenceId");
        // replicates kept sorted so that differences (and so the bootstrap) never depend on run order
        Map<Setting, Map<String, Map<Integer, RunResult>>> bySetting = new LinkedHashMap<>();
        Set<String> configurations = new LinkedHashSet<>();
        for (RunResult r : runs) {
            configurations.add(r.configurationId());
            RunResult previous = bySetting.computeIfAbsent(r.setting(), s -> new LinkedHashMap<>())
                    .computeIfAbsent(r.configurationId(), c -> new TreeMap<>()).put(r.replicate(), r);
            if (previous != null) {
                throw new IllegalArgumentException("two runs of '" + r.configurationId() + "' for replicate "
                        + r.replicate() + " of setting " + r.setting().label());
            }
        }
        if (!configurations.contains(referenceId)) {
            throw new IllegalArgumentException("the reference learner configuration '" + referenceId
                    + "' has no runs (configurations: " + String.join(", ", configurations) + ")");
        }
        List<ComparisonRow> out = new ArrayList<>();
        for (Map.Entry<Setting, Map<String, Map<Integer, RunResult>>> s : bySetting.entrySet()) {
            Map<Integer, RunResult> reference = s.getValue().getOrDefault(referenceId, Map.of());
            for (String metricName : metrics) {
                Metric metric = MetricAgainst.resolve(metricName);
                List<ComparisonRow> rows = new ArrayList<>();
                for (String config : configurations) {
                    if (config.equals(referenceId) || !s.getValue().containsKey(config)) {
                        continue;
                    }
                    rows.add(row(s.getKey(), metricName, metric, config, referenceId, s.getValue().get(config), reference, seed));
                }
                Double[] p = rows.stream().map(ComparisonRow::pValue).toArray(Double[]::new);
                Double[] adjusted = Holm.adjust(p);
                for (int k = 0; k < rows.size(); k++) {
                    out.add(rows.get(k).withHolm(adjusted[k]));
                }
            }
        }
        return out;
    }

    /** One configuration against the reference on one metric; {@code name} is the column, {@code metric} gives the direction. */
    private static ComparisonRow row(Setting setting, String name, Metric metric, String config, String referenceId,
                                     Map<Integer, RunResult> mine, Map<Integer, RunResult> reference, long seed) {
        List<double[]> pairs = new ArrayList<>();
        for (Map.Entry<Integer, RunResult> e : mine.entrySet()) {
            RunResult ref = reference.get(e.getKey());
            Double x = e.getValue().value(name);
            Double y = ref == null ? null : ref.value(name);
            if (x != null && y != null) {
                pairs.add(new double[] {x, y});
            }
        }
        int n = pairs.size();
        boolean directed = metric.direction() != Direction.NONE;
        ComparisonRow.Builder row = ComparisonRow.builder().setting(setting).metric(name).configurationId(config)
                .referenceId(referenceId).pairs(n);
        if (n == 0) {
            return row.wins(directed ? 0 : null).ties(directed ? 0 : null).losses(directed ? 0 : null).build();
        }
        double[] d = new double[n];
        int wins = 0;
        int losses = 0;
        for (int k = 0; k < n; k++) {
            double x = pairs.get(k)[0];
            double y = pairs.get(k)[1];
            d[k] = x - y;
            int c = metric.direction().compare(x, y);
            wins += c > 0 ? 1 : 0;
            losses += c < 0 ? 1 : 0;
        }
        double mean = 0;
        for (double v : d) {
            mean += v;
        }
        mean /= n;
        Double low = null;
        Double high = null;
        if (n >= 2) {
            double[] ci = Bootstrap.meanInterval(d, Summaries.LEVEL, Bootstrap.DEFAULT_RESAMPLES,
                    Seeds.random(Seeds.derive(seed, "comparison", setting.label(), name, config, referenceId)));
            low = ci[0];
            high = ci[1];
        }
        return row.meanDifference(mean).low(low).high(high).pValue(wilcoxon(d))
                .wins(directed ? wins : null).ties(directed ? n - wins - losses : null).losses(directed ? losses : null)
                .build();
    }

    /** The two-sided signed-rank p-value, or null when every difference is zero. */
    static Double wilcoxon(double[] differences) {
        return SignedRankTest.test(differences).pValue();
    }
}

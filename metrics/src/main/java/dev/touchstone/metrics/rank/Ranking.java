package dev.touchstone.metrics.rank;

import dev.touchstone.metrics.results.RankingResult;
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
import java.util.Set;

/**
 * Ranks learner configurations over the settings of a study on one metric, the procedure
 * recommended by Demšar (2006): each configuration's value in a setting is its mean over the
 * ok replicates with a defined value; configurations are ranked within each setting (1 = best by
 * the metric's direction, ties share mean ranks); the Friedman test asks whether the mean ranks
 * differ at all, and the Nemenyi critical difference says which pairs differ.
 *
 * <p>Settings where some configuration has no value are left out (the Friedman test needs
 * complete blocks) and counted. Cost O(runs + settings · k log k).
 */
public final class Ranking {

    private Ranking() {
    }

    /**
     * The ranking on {@code metric} at significance level {@code alpha} (0.05 or 0.10 for a
     * critical difference).
     *
     * @throws IllegalArgumentException for an unknown metric or one without a direction
     */
    public static RankingResult over(List<RunResult> runs, String metric, double alpha) {
        Metric m = MetricAgainst.resolve(metric);
        if (m.direction() == Direction.NONE) {
            throw new IllegalArgumentException("metric '" + metric + "' has no direction (higher or lower is better), so it cannot be ranked");
        }
        Set<String> configurations = new LinkedHashSet<>();
        Map<Setting, Map<String, double[]>> sums = new LinkedHashMap<>();
        for (RunResult r : runs) {
            configurations.add(r.configurationId());
            Map<String, double[]> row = sums.computeIfAbsent(r.setting(), s -> new LinkedHashMap<>());
            Double v = r.value(metric);
            if (v != null) {
                double[] acc = row.computeIfAbsent(r.configurationId(), c -> new double[2]);
                acc[0] += v;
                acc[1]++;
            }
        }
        List<String> configs = new ArrayList<>(configurations);
        int k = configs.size();
        List<double[]> blocks = new ArrayList<>();
        int dropped = 0;
        double sign = m.direction() == Direction.HIGHER_IS_BETTER ? -1 : 1;
        for (Map<String, double[]> row : sums.values()) {
            double[] block = new double[k];
            boolean complete = true;
            for (int j = 0; j < k && complete; j++) {
                double[] acc = row.get(configs.get(j));
                complete = acc != null;
                if (complete) {
                    block[j] = sign * acc[0] / acc[1];
                }
            }
            if (complete) {
                blocks.add(block);
            } else {
                dropped++;
            }
        }
        int n = blocks.size();
        List<Double> meanRanks = new ArrayList<>();
        Double chi = null;
        Double p = null;
        if (n >= 2 && k >= 2) {
            FriedmanTest.Result f = FriedmanTest.test(blocks.toArray(new double[0][]));
            for (double r : f.meanRanks()) {
                meanRanks.add(r);
            }
            chi = Double.isNaN(f.chiSquare()) ? null : f.chiSquare();
            p = Double.isNaN(f.pValue()) ? null : f.pValue();
        } else if (n == 1 && k >= 1) {
            double[] ranks = new org.apache.commons.statistics.ranking.NaturalRanking().apply(blocks.get(0));
            for (double r : ranks) {
                meanRanks.add(r);
            }
        } else {
            for (int j = 0; j < k; j++) {
                meanRanks.add(null);
            }
        }
        Double cd = n >= 1 ? Nemenyi.criticalDifference(k, n, alpha) : null;
        return RankingResult.builder().metric(metric).configurations(configs).meanRanks(meanRanks)
                .settingsUsed(n).settingsDropped(dropped).friedmanChiSquare(chi).degreesOfFreedom(Math.max(k - 1, 0))
                .friedmanPValue(p).alpha(alpha).criticalDifference(cd).build();
    }
}

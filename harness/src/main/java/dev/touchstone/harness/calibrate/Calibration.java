package dev.touchstone.harness.calibrate;

import dev.touchstone.core.data.DataSet;
import dev.touchstone.core.graph.Graph;
import dev.touchstone.core.param.ParameterValues;
import dev.touchstone.core.random.Seeds;
import dev.touchstone.generators.fit.FitDiagnostics;
import dev.touchstone.generators.fit.FittedModel;
import dev.touchstone.generators.fit.FittedTruth;
import dev.touchstone.generators.fit.Perturbation;
import dev.touchstone.generators.fit.StructureFit;
import dev.touchstone.harness.execution.LocalExecutor;
import dev.touchstone.harness.execution.MetricsScorer;
import dev.touchstone.harness.execution.PerformedRun;
import dev.touchstone.harness.execution.Progress;
import dev.touchstone.harness.execution.Replicate;
import dev.touchstone.harness.execution.RunBatch;
import dev.touchstone.harness.execution.RunPerformer;
import dev.touchstone.harness.execution.SettingLayout;
import dev.touchstone.harness.execution.Simulator;
import dev.touchstone.harness.study.LearnerConfig;
import dev.touchstone.harness.study.ReplicateSeeds;
import dev.touchstone.harness.study.RunDefinition;
import dev.touchstone.harness.study.SampleSize;
import dev.touchstone.harness.study.TruthSetting;
import dev.touchstone.metrics.results.Setting;
import org.apache.commons.rng.UniformRandomProvider;

import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;

/**
 * Calibrates learners to one data set. The truth DAG (given, or learned by the caller) is
 * fitted to the data ({@link StructureFit}); {@code variants} perturbed truths are made
 * around it ({@link Perturbation}); replicate r is drawn from truth r mod (1 + variants)
 * at the largest sample size, smaller sizes being its prefixes; every learner runs on every
 * replicate and size and is scored against the truth of its class (the study runner's
 * {@link RunPerformer} and {@link MetricsScorer}); and every learner runs on
 * {@code bootstrap} resamples (rows drawn with replacement, Efron 1979) of the real data.
 *
 * <p>All of it goes through the study harness's execution step ({@link RunBatch} on a
 * {@link LocalExecutor}): one list of runs, worker threads, per-run deadlines, progress; the
 * results, with the estimates the learners returned, are kept in memory, as no study or
 * journal is involved. Seeds: variant k from {@code Seeds.derive(seed, "variant", k)}; replicates and resamples from the runs'
 * {@link ReplicateSeeds}; learners from the runs' coordinates. So results are the same for
 * any number of threads. Cost: (replicates × sizes + bootstrap) × learners runs, plus one
 * re-fit per variant.
 */
public final class Calibration {

    /** The name of the fitted truth. */
    public static final String FITTED = "fitted";
    /** The truth-setting name of bootstrap resamples. */
    public static final String BOOTSTRAP = "bootstrap";
    /** The one coordinate of a calibration's truth settings: which truth, or the bootstrap. */
    private static final String TRUTH = "truth";

    private Calibration() {
    }

    /**
     * Runs a calibration.
     *
     * @param data     the real data
     * @param truthDag the DAG to fit (over the data's columns, in order)
     * @param settings what to run
     * @param progress told the total, each finished run and the end
     */
    public static CalibrationOutcome run(DataSet data, Graph truthDag, CalibrationSettings settings,
                                         Progress progress) {
        FittedModel fitted = StructureFit.fit(truthDag, data);
        List<FittedTruth> truths = new ArrayList<>();
        truths.add(fitted.truth(FITTED, "parameters fitted to the data over the truth graph"));
        for (int k = 1; k <= settings.variants(); k++) {
            truths.add(Perturbation.defaults().apply(fitted, data, "variant-" + k,
                    Seeds.derive(settings.seed(), "variant", k)));
        }
        List<TruthSetting> settingsList = new ArrayList<>();
        for (int t = 0; t < truths.size(); t++) {
            settingsList.add(setting(t, truths.get(t).name()));
        }
        TruthSetting boot = setting(truths.size(), BOOTSTRAP);
        settingsList.add(boot);

        List<LearnerConfig> configs = new ArrayList<>();
        for (int i = 0; i < settings.learners().size(); i++) {
            CalibrationSettings.Choice c = settings.learners().get(i);
            configs.add(new LearnerConfig(i, c.id(), c.learner(), c.values()));
        }
        List<RunDefinition> runs = new ArrayList<>();
        int largest = 0;
        for (int n : settings.samples()) {
            largest = Math.max(largest, n);
        }
        for (int r = 0; r < settings.replicates(); r++) {
            TruthSetting t = settingsList.get(r % truths.size());
            for (int n : settings.samples()) {
                for (LearnerConfig c : configs) {
                    runs.add(run(runs.size(), t, r, SampleSize.of(n), c, settings).metrics(CalibrationSettings.METRICS)
                            .build());
                }
            }
        }
        for (int b = 0; b < settings.bootstrap(); b++) {
            for (LearnerConfig c : configs) {
                runs.add(run(runs.size(), boot, b, SampleSize.of(data.rows()), c, settings).build());
            }
        }
        RunPerformer performer = new RunPerformer(new MetricsScorer(), Calibration::coordinates);
        Simulator simulator = simulator(truths, fitted.dag(), data);
        PerformedRun[] performed = new PerformedRun[runs.size()];
        progress.start(runs.size(), 0);
        RunBatch.execute(new LocalExecutor(settings.threads(), simulator, performer), runs,
                Math.max(largest, data.rows()), (run, done) -> {
                    performed[run.index()] = done;
                    progress.finished(done.result());
                });
        progress.end();
        List<CalibrationOutcome.Run> done = new ArrayList<>();
        for (RunDefinition r : runs) {
            boolean isBoot = r.truth().index() == truths.size();
            done.add(new CalibrationOutcome.Run(isBoot ? null : truths.get(r.truth().index()), r.replicate(),
                    r.sample().intRows(), r.config().entryId(), performed[r.index()]));
        }
        return new CalibrationOutcome(data, new CalibrationOutcome.Fit(fitted, FitDiagnostics.of(fitted)), truths,
                settings, done);
    }

    /** A run of the calibration but for its metrics (none by default). */
    private static RunDefinition.Builder run(int index, TruthSetting truth, int replicate, SampleSize sample,
                                             LearnerConfig config, CalibrationSettings settings) {
        return RunDefinition.builder().index(index).truth(truth).replicate(replicate).sample(sample).config(config)
                .studySeed(settings.seed()).limit(settings.limit());
    }

    /** A run's setting: the truth it was drawn from (its name, or {@value #BOOTSTRAP}) and its sample size. */
    private static Setting coordinates(RunDefinition run) {
        Map<String, String> m = new LinkedHashMap<>();
        m.put(TRUTH, run.truth().choices().get(0).kind());
        m.put(SettingLayout.SAMPLES, run.sample().word());
        return new Setting(m);
    }

    private static TruthSetting setting(int index, String name) {
        return new TruthSetting(index, List.of(new TruthSetting.Choice(TRUTH, name, ParameterValues.none(),
                Map.of())));
    }

    /** Replicates of the truths, and bootstrap resamples of the data (exactly as many rows as the data). */
    private static Simulator simulator(List<FittedTruth> truths, Graph fittedDag, DataSet data) {
        return (TruthSetting truth, ReplicateSeeds seeds, int rows) -> {
            if (truth.index() < truths.size()) {
                FittedTruth t = truths.get(truth.index());
                return new Replicate(t.dag(), t.sample(rows, seeds.replicateSeed()), null);
            }
            return new Replicate(fittedDag, resample(data, seeds.replicateSeed()), null);
        };
    }

    /** A nonparametric bootstrap resample: n rows drawn uniformly with replacement. Cost O(n · p). */
    static DataSet resample(DataSet data, long seed) {
        UniformRandomProvider rng = Seeds.random(seed);
        int[] rows = new int[data.rows()];
        for (int i = 0; i < rows.length; i++) {
            rows[i] = rng.nextInt(data.rows());
        }
        return data.rows(rows);
    }
}

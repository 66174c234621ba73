package dev.touchstone.benchmarks.harness;

import dev.touchstone.core.data.DataKind;
import dev.touchstone.core.graph.Graph;
import dev.touchstone.core.graph.GraphClass;
import dev.touchstone.core.knowledge.Knowledge;
import dev.touchstone.core.learner.Estimate;
import dev.touchstone.core.learner.Learner;
import dev.touchstone.core.learner.LearnerDescription;
import dev.touchstone.core.learner.LearnerFamily;
import dev.touchstone.core.learner.LearnerInput;
import dev.touchstone.core.learner.MissingValues;
import dev.touchstone.core.learner.RunContext;
import dev.touchstone.core.param.ParameterSpec;
import dev.touchstone.core.param.ParameterValues;
import dev.touchstone.harness.catalog.LearnerCatalog;
import dev.touchstone.harness.execution.GeneratorSimulator;
import dev.touchstone.harness.execution.Journal;
import dev.touchstone.harness.execution.JournalCodec;
import dev.touchstone.harness.execution.MetricsAggregator;
import dev.touchstone.harness.execution.MetricsScorer;
import dev.touchstone.harness.execution.Progress;
import dev.touchstone.harness.execution.Replicate;
import dev.touchstone.harness.execution.StudyRunner;
import dev.touchstone.harness.study.Expansion;
import dev.touchstone.harness.study.GeneratorTruthCatalog;
import dev.touchstone.harness.study.NodeReader;
import dev.touchstone.harness.study.Plan;
import dev.touchstone.harness.study.RegistryMetricCatalog;
import dev.touchstone.harness.study.RunDefinition;
import dev.touchstone.harness.study.StudyReader;
import dev.touchstone.metrics.results.RunResult;
import org.openjdk.jmh.annotations.Benchmark;
import org.openjdk.jmh.annotations.BenchmarkMode;
import org.openjdk.jmh.annotations.Fork;
import org.openjdk.jmh.annotations.Level;
import org.openjdk.jmh.annotations.Measurement;
import org.openjdk.jmh.annotations.Mode;
import org.openjdk.jmh.annotations.OutputTimeUnit;
import org.openjdk.jmh.annotations.Param;
import org.openjdk.jmh.annotations.Scope;
import org.openjdk.jmh.annotations.Setup;
import org.openjdk.jmh.annotations.State;
import org.openjdk.jmh.annotations.TearDown;
import org.openjdk.jmh.annotations.Warmup;
import org.openjdk.jmh.infra.Blackhole;

import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.Comparator;
import java.util.List;
import java.util.concurrent.TimeUnit;
import java.util.stream.Stream;

/**
 * A study of 10,000 runs with an empty-graph learner on p = 10, n = 100 (issue 7's target:
 * at most 20 s on 2 cores, journaling at most 5% of it), against its irreducible parts
 * measured in the same run: drawing the replicates, scoring the estimates, and journaling
 * 10,000 results alone.
 *
 * <p>{@code configs} is the number of learner configurations per replicate: 1 means 10,000
 * replicates with one run each (simulation is not shared at all, the worst case); 10 means
 * 1,000 replicates with ten runs each.
 */
@State(Scope.Benchmark)
@BenchmarkMode(Mode.SingleShotTime)
@OutputTimeUnit(TimeUnit.MILLISECONDS)
@Warmup(iterations = 1)
@Measurement(iterations = 3)
@Fork(1)
public class StudyRunnerBenchmark {

    /** A private empty-graph learner (the built-in baseline is written elsewhere). */
    static final Learner EMPTY = new Learner() {
        private final LearnerDescription d = LearnerDescription.builder("bench-empty").summary("empty graph")
                .publication("common practice").family(LearnerFamily.BASELINE).accepts(DataKind.CONTINUOUS)
                .returns(GraphClass.DAG).missingValues(MissingValues.REJECTS)
                .parameter(ParameterSpec.integer("label", 0, 0, 100, "only makes configurations")).build();

        @Override
        public LearnerDescription description() {
            return d;
        }

        @Override
        public Estimate learn(LearnerInput input, Knowledge k, ParameterValues p, RunContext c) {
            return Estimate.of(Graph.empty(input.variableNames()), GraphClass.DAG);
        }
    };

    @Param({"1", "10"})
    public int configs;

    Plan plan;
    Path dir;
    List<RunResult> results;

    @Setup(Level.Trial)
    public void plan() throws IOException {
        StringBuilder labels = new StringBuilder();
        for (int i = 0; i < configs; i++) {
            labels.append(i == 0 ? "" : ", ").append(i);
        }
        String study = "name: bench\nseed: 1\nreplicates: " + (10_000 / configs) + "\n"
                + "truth:\n  graph: {family: erdos-renyi, nodes: 10, mean_degree: 2}\n  model: {kind: linear-gaussian}\n"
                + "samples: [100]\nlearners:\n  - {id: e, use: bench-empty, with: {label: [" + labels + "]}}\n"
                + "metrics: [shd, adjacency_f1, orientation_f1, seconds]\nlimits: {max_runs: 20000}\n";
        LearnerCatalog catalog = LearnerCatalog.builder().add(EMPTY, LearnerCatalog.Origin.BUILT_IN, "bench").build();
        var truth = new GeneratorTruthCatalog();
        var s = new StudyReader(truth, catalog, new RegistryMetricCatalog()).read(NodeReader.read("b.yaml", study, false));
        plan = new Expansion(truth).expand(s, catalog);
        Path out = Files.createTempDirectory("bench-study");
        new StudyRunner(new GeneratorSimulator(), new MetricsScorer(), new MetricsAggregator())
                .run(plan, new StudyRunner.Options(out, 2, Progress.quiet(), null));
        results = new ArrayList<>(Journal.read(out.resolve(Journal.FILE_NAME)).lines().values().stream()
                .map(JournalCodec.Line::result).toList());
        delete(out);
    }

    @Setup(Level.Iteration)
    public void folder() throws IOException {
        dir = Files.createTempDirectory("bench-study");
    }

    @TearDown(Level.Iteration)
    public void clean() throws IOException {
        delete(dir);
    }

    /** The whole study on 2 threads: expansion done, simulation, learner, scoring, journal, CSV tables, statistics. */
    @Benchmark
    public StudyRunner.Outcome wholeStudy() {
        return new StudyRunner(new GeneratorSimulator(), new MetricsScorer(), new MetricsAggregator())
                .run(plan, new StudyRunner.Options(dir.resolve("out"), 2, Progress.quiet(), null));
    }

    /** Irreducible part: drawing every replicate once (one thread). */
    @Benchmark
    public void simulationOnly(Blackhole bh) {
        GeneratorSimulator sim = new GeneratorSimulator();
        for (RunDefinition r : plan.runs()) {
            if (r.config().index() == 0) {
                bh.consume(sim.draw(r.truth(), r.seeds(), 100));
            }
        }
    }

    /** Irreducible part: scoring an empty estimate against each replicate's truth (one thread). */
    @Benchmark
    public void scoringOnly(Blackhole bh) {
        GeneratorSimulator sim = new GeneratorSimulator();
        MetricsScorer scorer = new MetricsScorer();
        Replicate rep = sim.draw(plan.runs().get(0).truth(), plan.runs().get(0).seeds(), 100);
        Estimate e = Estimate.of(Graph.empty(rep.data().names()), GraphClass.DAG);
        for (int i = 0; i < plan.runs().size(); i++) {
            bh.consume(scorer.score(rep, e, List.of("shd", "adjacency_f1", "orientation_f1")));
        }
    }

    /** Journaling alone: 10,000 results appended (group commit, synced) and closed. */
    @Benchmark
    public void journalOnly() {
        try (Journal j = Journal.open(dir.resolve("journal.jsonl"))) {
            for (int i = 0; i < results.size(); i++) {
                j.append(new JournalCodec.Line(i, "run " + i, results.get(i)), null);
            }
        }
    }

    private static void delete(Path d) throws IOException {
        try (Stream<Path> s = Files.walk(d)) {
            for (Path p : s.sorted(Comparator.reverseOrder()).toList()) {
                Files.deleteIfExists(p);
            }
        }
    }
}

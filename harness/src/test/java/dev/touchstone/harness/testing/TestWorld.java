package dev.touchstone.harness.testing;

import dev.touchstone.core.data.DataKind;
import dev.touchstone.core.data.DataSet;
import dev.touchstone.core.graph.Graph;
import dev.touchstone.core.graph.GraphClass;
import dev.touchstone.core.graph.MutableGraph;
import dev.touchstone.core.knowledge.Knowledge;
import dev.touchstone.core.learner.DeadlineExceededException;
import dev.touchstone.core.learner.Estimate;
import dev.touchstone.core.learner.Learner;
import dev.touchstone.core.learner.LearnerDescription;
import dev.touchstone.core.learner.LearnerFamily;
import dev.touchstone.core.learner.LearnerInput;
import dev.touchstone.core.learner.MissingValues;
import dev.touchstone.core.learner.OracleUse;
import dev.touchstone.core.learner.RunContext;
import dev.touchstone.core.param.ParameterSpec;
import dev.touchstone.core.param.ParameterValues;
import dev.touchstone.core.random.Seeds;
import dev.touchstone.harness.catalog.LearnerCatalog;
import dev.touchstone.harness.execution.Aggregator;
import dev.touchstone.harness.execution.Replicate;
import dev.touchstone.harness.execution.Scorer;
import dev.touchstone.harness.execution.Simulator;
import dev.touchstone.harness.execution.StudyRunner;
import dev.touchstone.harness.study.Expansion;
import dev.touchstone.harness.study.MetricCatalog;
import dev.touchstone.harness.study.NodeReader;
import dev.touchstone.harness.study.Plan;
import dev.touchstone.harness.study.StudyReader;
import dev.touchstone.harness.study.TruthCatalog;
import dev.touchstone.harness.study.TruthSetting;
import dev.touchstone.metrics.results.AggregateRow;
import dev.touchstone.metrics.results.ComparisonRow;
import dev.touchstone.metrics.results.RunResult;
import dev.touchstone.metrics.results.Summary;
import org.apache.commons.rng.UniformRandomProvider;

import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;

/**
 * A tiny, self-contained world for testing the harness without the generators and metrics
 * modules: a chain graph family, a linear Gaussian model drawn row by row, a scorer that
 * counts edges and skeleton differences, a mean-only aggregator, and a handful of test
 * learners (empty graph, oracle skeleton, a sleeper that honours its deadline, one that throws).
 */
public final class TestWorld {

    private TestWorld() {
    }

    public static final TruthCatalog TRUTH = new TruthCatalog() {
        @Override
        public List<Section> sections() {
            return List.of(
                    Section.builder("graph", "family").meaning("the graph").kinds(
                            List.of(new Kind("chain", "X1 -> X2 -> ... -> Xp", List.of(
                                    ParameterSpec.integer("nodes", 5, 2, 1000, "number of variables"))),
                                    new Kind("star", "X1 -> every other", List.of(
                                            ParameterSpec.integer("nodes", 5, 2, 1000, "number of variables"))))).build(),
                    Section.builder("model", "kind").meaning("the model").kinds(
                            List.of(new Kind("linear-gaussian", "linear with Gaussian noise", List.of(
                                    ParameterSpec.real("edge_weight_low", 0.5, 0.0, 10.0, "smallest weight"),
                                    ParameterSpec.real("edge_weight_high", 1.5, 0.0, 10.0, "largest weight"),
                                    ParameterSpec.bool("standardize", false, "scale columns"))))).build(),
                    Section.builder("hidden", "kind").defaultKind("none").shorthand("random", "count")
                            .meaning("hidden variables").kinds(List.of(new Kind("none", "nothing hidden", List.of()),
                                    new Kind("random", "hide some", List.of(
                                            ParameterSpec.integer("count", 0, 0, 100, "how many"))))).build(),
                    Section.builder("missing", "mechanism").defaultKind("none").meaning("missing cells").kinds(
                            List.of(new Kind("none", "complete data", List.of()))).build());
        }

        @Override
        public void checkCombination(TruthSetting s) {
            TruthSetting.Choice h = s.choice("hidden");
            if (h.kind().equals("random") && h.values().getInt("count") >= s.choice("graph").values().getInt("nodes")) {
                throw new IllegalArgumentException("hidden.count must be smaller than graph.nodes");
            }
            TruthSetting.Choice m = s.choice("model");
            if (m.values().getDouble("edge_weight_low") > m.values().getDouble("edge_weight_high")) {
                throw new IllegalArgumentException("model.edge_weight_low is larger than model.edge_weight_high");
            }
        }
    };

    public static final MetricCatalog METRICS = new MetricCatalog() {
        private final List<String> names = List.of("shd", "edges", "seconds", "tests");

        @Override
        public List<String> names() {
            return names;
        }

        @Override
        public String meaning(String name) {
            return "test metric " + name;
        }

        @Override
        public List<String> defaults() {
            return List.of("shd", "edges");
        }
    };

    /** Draws a chain or star with weights in [low, high] and n rows, row by row (so prefixes are nested). */
    public static final Simulator SIMULATOR = (truth, seeds, rows) -> {
        TruthSetting.Choice g = truth.choice("graph");
        int p = g.values().getInt("nodes");
        List<String> names = new ArrayList<>();
        for (int i = 1; i <= p; i++) {
            names.add("X" + i);
        }
        MutableGraph b = Graph.builder(names);
        int[] parent = new int[p];
        parent[0] = -1;
        for (int i = 1; i < p; i++) {
            parent[i] = g.kind().equals("chain") ? i - 1 : 0;
            b.addDirected(parent[i], i);
        }
        Graph dag = b.freeze();
        TruthSetting.Choice m = truth.choice("model");
        UniformRandomProvider wr = Seeds.random(seeds.section("model"));
        double lo = m.values().getDouble("edge_weight_low");
        double hi = m.values().getDouble("edge_weight_high");
        double[] w = new double[p];
        for (int i = 0; i < p; i++) {
            w[i] = lo + (hi - lo) * wr.nextDouble();
        }
        if (rows == 0) {
            return new Replicate(dag, null, null);
        }
        UniformRandomProvider dr = Seeds.random(seeds.data());
        double[][] cols = new double[p][rows];
        for (int r = 0; r < rows; r++) {
            for (int i = 0; i < p; i++) {
                double noise = gaussian(dr);
                cols[i][r] = (parent[i] < 0 ? 0 : w[i] * cols[parent[i]][r]) + noise;
            }
        }
        DataSet.Builder db = DataSet.builder(rows);
        for (int i = 0; i < p; i++) {
            db.continuous(names.get(i), cols[i]);
        }
        return new Replicate(dag, db.build(), null);
    };

    private static double gaussian(UniformRandomProvider r) {
        double u = r.nextDouble();
        double v = r.nextDouble();
        return Math.sqrt(-2 * Math.log(1 - u)) * Math.cos(2 * Math.PI * v);
    }

    /** {@code edges}: estimated edge count; {@code shd}: pairs whose adjacency differs from the true DAG's. */
    public static final Scorer SCORER = (replicate, estimate, metrics) -> {
        Graph t = replicate.trueDag();
        Graph e = estimate.graph();
        int shd = 0;
        for (int i = 0; i < t.size(); i++) {
            for (int j = i + 1; j < t.size(); j++) {
                if (t.adjacent(i, j) != e.adjacent(i, j)) {
                    shd++;
                }
            }
        }
        Map<String, Double> v = new LinkedHashMap<>();
        for (String name : metrics) {
            v.put(name, name.equals("shd") ? (double) shd : (double) e.edgeCount());
        }
        return new Scorer.Scored(estimate.graphClass(), v);
    };

    /** Means only; comparisons with pairs and mean difference only. */
    public static final Aggregator AGGREGATOR = new Aggregator() {
        @Override
        public List<AggregateRow> summarise(List<RunResult> runs, List<String> metrics, long seed) {
            Map<String, List<RunResult>> groups = new LinkedHashMap<>();
            for (RunResult r : runs) {
                groups.computeIfAbsent(r.setting().label() + "|" + r.configurationId(), k -> new ArrayList<>()).add(r);
            }
            List<AggregateRow> out = new ArrayList<>();
            for (List<RunResult> g : groups.values()) {
                for (String m : metrics) {
                    int ok = 0;
                    int failed = 0;
                    int skipped = 0;
                    double sum = 0;
                    int count = 0;
                    for (RunResult r : g) {
                        if (r.isOk()) {
                            ok++;
                            Double v = r.value(m);
                            if (v != null) {
                                sum += v;
                                count++;
                            }
                        } else if (r.status().isFailure()) {
                            failed++;
                        } else {
                            skipped++;
                        }
                    }
                    Summary s = count == 0 ? Summary.EMPTY
                            : new Summary(count, sum / count, null, Summary.Interval.UNDEFINED,
                                    Summary.Quartiles.UNDEFINED);
                    out.add(AggregateRow.builder().setting(g.get(0).setting())
                            .configurationId(g.get(0).configurationId()).learnerId(g.get(0).learnerId()).metric(m)
                            .okRuns(ok).failedRuns(failed).skippedRuns(skipped).summary(s).build());
                }
            }
            return out;
        }

        @Override
        public List<ComparisonRow> compare(List<RunResult> runs, List<String> metrics, String reference, long seed) {
            return List.of();
        }
    };

    // ---- learners

    private static LearnerDescription.Builder base(String id) {
        return LearnerDescription.builder(id).summary("test learner " + id).publication("test only")
                .family(LearnerFamily.BASELINE).accepts(DataKind.CONTINUOUS).returns(GraphClass.DAG)
                .missingValues(MissingValues.REJECTS);
    }

    /** Returns the empty graph; one parameter to make configurations. */
    public static final Learner EMPTY = new Learner() {
        private final LearnerDescription d = base("empty-test")
                .parameter(ParameterSpec.real("alpha", 0.05, 0.0, 1.0, "ignored")).build();

        @Override
        public LearnerDescription description() {
            return d;
        }

        @Override
        public Estimate learn(LearnerInput input, Knowledge k, ParameterValues p, RunContext c) {
            return Estimate.of(Graph.empty(input.variableNames()), GraphClass.DAG);
        }
    };

    /** Joins every pair the oracle (or a correlation threshold on data) says is marginally dependent; counts tests. */
    public static final Learner SKELETON = new Learner() {
        private final LearnerDescription d = base("skeleton-test").returns(GraphClass.CPDAG)
                .oracle(OracleUse.INDEPENDENCE)
                .parameter(ParameterSpec.real("threshold", 0.2, 0.0, 1.0, "absolute correlation")).build();

        @Override
        public LearnerDescription description() {
            return d;
        }

        @Override
        public Estimate learn(LearnerInput input, Knowledge k, ParameterValues p, RunContext c) {
            List<String> names = input.variableNames();
            MutableGraph b = Graph.builder(names);
            double th = p.getDouble("threshold");
            for (int i = 0; i < names.size(); i++) {
                for (int j = i + 1; j < names.size(); j++) {
                    c.countTests(1);
                    boolean dependent;
                    if (input.isOracle()) {
                        dependent = !input.oracle().independent(i, j, new int[0]);
                    } else {
                        var cov = input.data().covariance();
                        double r = cov.get(i, j) / Math.sqrt(cov.get(i, i) * cov.get(j, j));
                        dependent = Math.abs(r) > th;
                    }
                    if (dependent) {
                        b.addUndirected(i, j);
                    }
                }
            }
            return Estimate.of(b.freeze(), GraphClass.CPDAG);
        }
    };

    /** Sleeps {@code millis}, checking its deadline every millisecond. */
    public static final Learner SLEEPER = new Learner() {
        private final LearnerDescription d = base("sleeper-test")
                .parameter(ParameterSpec.integer("millis", 10, 0, 1_000_000, "how long")).build();

        @Override
        public LearnerDescription description() {
            return d;
        }

        @Override
        public Estimate learn(LearnerInput input, Knowledge k, ParameterValues p, RunContext c) {
            long end = System.nanoTime() + p.getInt("millis") * 1_000_000L;
            while (System.nanoTime() < end) {
                c.checkDeadline();
                try {
                    Thread.sleep(1);
                } catch (InterruptedException e) {
                    Thread.currentThread().interrupt();
                    throw new DeadlineExceededException("interrupted");
                }
            }
            return Estimate.of(Graph.empty(input.variableNames()), GraphClass.DAG);
        }
    };

    /** Always throws. */
    public static final Learner BOOM = new Learner() {
        private final LearnerDescription d = base("boom-test").build();

        @Override
        public LearnerDescription description() {
            return d;
        }

        @Override
        public Estimate learn(LearnerInput input, Knowledge k, ParameterValues p, RunContext c) {
            throw new IllegalStateException("the test learner always fails");
        }
    };

    public static LearnerCatalog learners() {
        return LearnerCatalog.builder()
                .add(EMPTY, LearnerCatalog.Origin.BUILT_IN, "test")
                .add(SKELETON, LearnerCatalog.Origin.BUILT_IN, "test")
                .add(SLEEPER, LearnerCatalog.Origin.BUILT_IN, "test")
                .add(BOOM, LearnerCatalog.Origin.BUILT_IN, "test")
                .build();
    }

    public static StudyReader reader() {
        return new StudyReader(TRUTH, learners(), METRICS);
    }

    /** Reads and expands a study from YAML text. */
    public static Plan plan(String yaml) {
        var study = reader().read(NodeReader.read("study.yaml", yaml, false));
        return new Expansion(TRUTH).expand(study, learners());
    }

    public static StudyRunner runner() {
        return new StudyRunner(SIMULATOR, SCORER, AGGREGATOR);
    }
}

package dev.touchstone.learners.composed;

import dev.touchstone.core.data.DataKind;
import dev.touchstone.core.data.DataSet;
import dev.touchstone.core.graph.Edge;
import dev.touchstone.core.graph.Graph;
import dev.touchstone.core.graph.GraphClass;
import dev.touchstone.core.graph.MutableGraph;
import dev.touchstone.core.graph.algorithms.Cpdags;
import dev.touchstone.core.knowledge.Knowledge;
import dev.touchstone.core.learner.Estimate;
import dev.touchstone.core.learner.KnowledgeUse;
import dev.touchstone.core.learner.Learner;
import dev.touchstone.core.learner.LearnerDescription;
import dev.touchstone.core.learner.LearnerException;
import dev.touchstone.core.learner.LearnerFamily;
import dev.touchstone.core.learner.LearnerInput;
import dev.touchstone.core.learner.MissingValues;
import dev.touchstone.core.learner.Oracle;
import dev.touchstone.core.learner.OracleUse;
import dev.touchstone.core.learner.RunContext;
import dev.touchstone.core.param.ParameterValues;
import dev.touchstone.core.testing.RandomDags;
import dev.touchstone.core.testing.SmallData;
import dev.touchstone.learners.constraint.PcLearner;
import dev.touchstone.learners.continuous.NotearsLearner;
import dev.touchstone.learners.functional.DirectLingamLearner;
import dev.touchstone.learners.score.GesLearner;
import dev.touchstone.learners.score.HillClimbLearner;
import dev.touchstone.learners.score.PopulationCovariance;
import org.junit.jupiter.api.DisplayName;
import org.junit.jupiter.api.Test;

import java.util.EnumSet;
import java.util.List;
import java.util.Map;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

class ComposedLearnerTest {

    private static final PcLearner PC = new PcLearner();
    private static final HillClimbLearner HC = new HillClimbLearner();

    private static ComposedLearner pcThenHc() {
        return ComposedLearner.of(List.of(ComposedStep.first(PC), new ComposedStep(HC, Handoff.ALLOWED_EDGES)));
    }

    private static ParameterValues values(Learner l, Map<String, Object> raw) {
        return ParameterValues.resolve("test", l.description().parameters(), raw);
    }

    private static Estimate learn(Learner l, LearnerInput in, Knowledge k, Map<String, Object> raw, RunContext c) {
        return l.learn(in, k, values(l, raw), c);
    }

    private static boolean skeletonWithin(Graph inner, Graph outer) {
        for (Edge e : inner.edges()) {
            if (!outer.adjacent(e.a(), e.b())) {
                return false;
            }
        }
        return true;
    }

    /**
     * The restriction of MMHC's second phase (Tsamardinos, Brown and Aliferis 2006, Machine
     * Learning 65; from memory): the score search may only add edges the first phase's skeleton
     * has. Run on 60 seeded random DAGs with linear Gaussian data; PC is also run on its own to
     * get the skeleton the composed learner's first step must have found. The same cases with
     * hill climbing alone must leave that skeleton at least once, or the check would prove nothing.
     */
    @Test
    @DisplayName("PC's skeleton then hill climbing never has an edge outside PC's skeleton (60 random linear Gaussian cases)")
    void neverLeavesPcSkeleton() {
        ComposedLearner composed = pcThenHc();
        int hcAloneLeft = 0;
        int nonEmpty = 0;
        for (long seed = 1; seed <= 60; seed++) {
            Graph truth = RandomDags.erdosRenyi(6 + (int) (seed % 5), 2.5, seed);
            DataSet data = SmallData.linearGaussian(truth, 150 + 10 * (int) (seed % 7), seed + 1000);
            LearnerInput in = LearnerInput.of(data);
            Map<String, Object> alpha = Map.of("alpha", seed % 2 == 0 ? 0.01 : 0.2);
            Graph pc = learn(PC, in, Knowledge.none(), alpha, RunContext.unlimited(seed)).graph();
            Graph got = learn(composed, in, Knowledge.none(), Map.of("pc.alpha", alpha.get("alpha")),
                    RunContext.unlimited(seed)).graph();
            assertTrue(skeletonWithin(got, pc), "seed " + seed + ": " + got + " leaves PC's skeleton " + pc);
            Graph alone = learn(HC, in, Knowledge.none(), Map.of(), RunContext.unlimited(seed)).graph();
            hcAloneLeft += skeletonWithin(alone, pc) ? 0 : 1;
            nonEmpty += got.edgeCount() > 0 ? 1 : 0;
        }
        assertTrue(hcAloneLeft > 0, "hill climbing alone never left PC's skeleton: the check would be vacuous");
        assertTrue(nonEmpty >= 50, "the composed learner found edges in only " + nonEmpty + " of 60 cases");
    }

    @Test
    @DisplayName("the description is derived from the steps: kinds in common, last class, strictest missing values, shared knowledge, oracle only if all")
    void derivedDescription() {
        LearnerDescription d = pcThenHc().description();
        assertEquals("pc-then-hill-climbing", d.id());
        assertEquals(LearnerFamily.HYBRID, d.family());
        assertEquals(GraphClass.DAG, d.returns());
        EnumSet<DataKind> kinds = EnumSet.copyOf(PC.description().accepts());
        kinds.retainAll(HC.description().accepts());
        assertEquals(kinds, d.accepts());
        EnumSet<KnowledgeUse> knowledge = EnumSet.copyOf(PC.description().knowledge());
        knowledge.retainAll(HC.description().knowledge());
        assertEquals(knowledge, d.knowledge());
        assertTrue(d.summary().contains("pc") && d.summary().contains("hill-climbing given the adjacencies of"), d.summary());
        assertFalse(d.takesStartGraph());
        assertTrue(d.parameter("pc.alpha") != null && d.parameter("hill-climbing.patience") != null);
        assertEquals(PC.description().parameters().size() + HC.description().parameters().size(), d.parameters().size());
        assertEquals(PC.description().parameter("alpha").defaultValue(), d.parameter("pc.alpha").defaultValue());

        // NOTEARS accepts continuous data only, uses the population covariance as its oracle, and honours no required edges
        LearnerDescription n = ComposedLearner.of(List.of(ComposedStep.first(PC),
                new ComposedStep(new NotearsLearner(), Handoff.ALLOWED_EDGES))).description();
        assertEquals(EnumSet.of(DataKind.CONTINUOUS), n.accepts());
        assertEquals(OracleUse.INDEPENDENCE, PC.description().oracle());
        assertEquals(OracleUse.COVARIANCE, new NotearsLearner().description().oracle());
        assertEquals(OracleUse.COVARIANCE, n.oracle());
        // DirectLINGAM cannot use the oracle, so neither can a composition that starts with it
        assertEquals(OracleUse.NONE, new DirectLingamLearner().description().oracle());
        assertEquals(OracleUse.NONE, ComposedLearner.of(List.of(ComposedStep.first(new DirectLingamLearner()),
                new ComposedStep(HC, Handoff.ALLOWED_EDGES))).description().oracle());
        assertFalse(n.knowledge().contains(KnowledgeUse.REQUIRED_EDGES));
        MissingValues strictest = PC.description().missingValues() == MissingValues.REJECTS
                || new NotearsLearner().description().missingValues() == MissingValues.REJECTS
                ? MissingValues.REJECTS : n.missingValues();
        assertEquals(strictest, n.missingValues());

        // a learner used twice gets a numbered name
        ComposedLearner twice = ComposedLearner.of(List.of(ComposedStep.first(HC),
                new ComposedStep(HC, Handoff.START_GRAPH)));
        assertEquals("hill-climbing-then-hill-climbing-2", twice.description().id());
        assertTrue(twice.description().parameter("hill-climbing-2.patience") != null);
        assertEquals("hill-climbing > start-graph > hill-climbing-2", twice.composition());
    }

    @Test
    @DisplayName("hand-ons the receiving learner does not honour, and malformed step lists, are refused with one line")
    void refusals() {
        assertEquals("step 2: learner direct-lingam does not honour forbidden edges, so it cannot be given allowed-edges",
                refusal(List.of(ComposedStep.first(PC), new ComposedStep(new DirectLingamLearner(), Handoff.ALLOWED_EDGES))));
        assertEquals("step 2: learner notears-linear does not honour required edges, so it cannot be given required-edges",
                refusal(List.of(ComposedStep.first(HC), new ComposedStep(new NotearsLearner(), Handoff.REQUIRED_EDGES))));
        assertEquals("step 2: required-edges needs the step before to return a dag, and pc returns a cpdag:"
                        + " knowledge can require only directed edges",
                refusal(List.of(ComposedStep.first(PC), new ComposedStep(HC, Handoff.REQUIRED_EDGES))));
        assertEquals("step 2: learner direct-lingam cannot start from a given graph, so it cannot be given start-graph",
                refusal(List.of(ComposedStep.first(PC), new ComposedStep(new DirectLingamLearner(), Handoff.START_GRAPH))));
        assertTrue(refusal(List.of(ComposedStep.first(PC))).startsWith("a composed learner needs at least two steps"));
        assertTrue(refusal(List.of(new ComposedStep(PC, Handoff.ALLOWED_EDGES), new ComposedStep(HC, Handoff.ALLOWED_EDGES)))
                .startsWith("the first step receives nothing"));
        assertTrue(refusal(List.of(ComposedStep.first(PC), ComposedStep.first(HC)))
                .startsWith("step 2 (hill-climbing) must say how it is given the estimate"));
    }

    private static String refusal(List<ComposedStep> steps) {
        return assertThrows(IllegalArgumentException.class, () -> ComposedLearner.of(steps)).getMessage();
    }

    @Test
    @DisplayName("the run's test and score counts are the sums of the steps' (same context for all steps)")
    void countsAreSums() {
        Graph truth = RandomDags.erdosRenyi(7, 2.0, 4);
        LearnerInput in = LearnerInput.of(SmallData.linearGaussian(truth, 300, 9));
        RunContext pcAlone = RunContext.unlimited(5);
        Graph pc = learn(PC, in, Knowledge.none(), Map.of(), pcAlone).graph();
        RunContext hcAlone = RunContext.unlimited(5);
        learn(HC, in, Handoff.ALLOWED_EDGES.knowledge(Knowledge.none(), pc), Map.of(), hcAlone);
        RunContext both = RunContext.unlimited(5);
        learn(pcThenHc(), in, Knowledge.none(), Map.of(), both);
        assertTrue(pcAlone.tests() > 0 && hcAlone.scores() > 0);
        assertEquals(pcAlone.tests() + hcAlone.tests(), both.tests());
        assertEquals(pcAlone.scores() + hcAlone.scores(), both.scores());
    }

    /**
     * A greedy climb that starts at a local maximum and may not take worsening steps makes no
     * move (definition of a local maximum; common practice): hill climbing handed its own result
     * as a start graph returns it unchanged, after zero steps, whereas from the empty graph it
     * takes steps. Shows the start graph is where the search begins.
     */
    @Test
    @DisplayName("hill climbing handed a start graph begins there: from its own local maximum it makes no step")
    void startGraphIsWhereTheSearchBegins() {
        Graph truth = RandomDags.erdosRenyi(7, 2.0, 21);
        LearnerInput in = LearnerInput.of(SmallData.linearGaussian(truth, 500, 22));
        Map<String, Object> greedy = Map.of("patience", 0, "perturbed_starts", 0);
        Estimate first = learn(HC, in, Knowledge.none(), greedy, RunContext.unlimited(1));
        assertTrue(first.extras().get("steps") > 0);
        Estimate again = learn(HC, in.withStart(first.graph()), Knowledge.none(), greedy, RunContext.unlimited(1));
        assertEquals(0.0, again.extras().get("steps"));
        assertTrue(again.graph().sameEdges(first.graph()));

        ComposedLearner twice = ComposedLearner.of(List.of(ComposedStep.first(HC), new ComposedStep(HC, Handoff.START_GRAPH)));
        Estimate composed = learn(twice, in, Knowledge.none(), Map.of("hill-climbing.patience", 0,
                "hill-climbing.perturbed_starts", 0, "hill-climbing-2.patience", 0, "hill-climbing-2.perturbed_starts", 0),
                RunContext.unlimited(1));
        assertEquals(first.extras().get("steps"), composed.extras().get("hill-climbing.steps"));
        assertEquals(0.0, composed.extras().get("hill-climbing-2.steps"));
        assertTrue(composed.graph().sameEdges(first.graph()));
    }

    /**
     * PC with the oracle returns the true CPDAG (Spirtes, Glymour and Scheines 2000, PC's
     * correctness under faithfulness); GES handed it as a start graph with the oracle's score
     * makes no move, because at the true class no Insert and no Delete raises a consistent
     * score in the large-sample limit (Chickering 2002, local consistency), whereas GES alone
     * from the empty graph makes forward moves. Shows the start graph is where GES begins.
     */
    @Test
    @DisplayName("GES handed PC's oracle CPDAG as a start graph begins there and makes no move (10 seeded DAGs)")
    void gesStartsFromTheGivenGraph() {
        GesLearner ges = new GesLearner();
        ComposedLearner pcThenGes = ComposedLearner.of(List.of(ComposedStep.first(PC), new ComposedStep(ges, Handoff.START_GRAPH)));
        for (long seed = 1; seed <= 10; seed++) {
            Graph truth = RandomDags.erdosRenyi(6 + (int) (seed % 6), 2.0, 400 + seed);
            LearnerInput in = LearnerInput.of(new Oracle(truth, PopulationCovariance.observed(truth, 0.5, 2.0, seed)));
            Estimate alone = learn(ges, in, Knowledge.none(), Map.of(), RunContext.unlimited(1));
            Estimate composed = learn(pcThenGes, in, Knowledge.none(), Map.of(), RunContext.unlimited(1));
            assertEquals(Cpdags.of(truth), composed.graph(), "seed " + seed);
            assertEquals(0.0, composed.extras().get("ges.forward-moves"), "seed " + seed);
            assertEquals(0.0, composed.extras().get("ges.backward-moves"), "seed " + seed);
            assertTrue(truth.edgeCount() == 0 || alone.extras().get("forward-moves") > 0, "seed " + seed);
        }
    }

    @Test
    @DisplayName("required edges from a DAG are all kept by the next step")
    void requiredEdgesAreKept() {
        Graph truth = RandomDags.erdosRenyi(6, 2.0, 31);
        LearnerInput in = LearnerInput.of(SmallData.linearGaussian(truth, 400, 32));
        ComposedLearner c = ComposedLearner.of(List.of(ComposedStep.first(HC), new ComposedStep(HC, Handoff.REQUIRED_EDGES)));
        Graph first = learn(HC, in, Knowledge.none(), Map.of(), RunContext.unlimited(3)).graph();
        Graph got = learn(c, in, Knowledge.none(), Map.of(), RunContext.unlimited(3)).graph();
        assertTrue(first.edgeCount() > 0);
        for (Edge e : first.edges()) {
            int from = e.isDirectedFrom(e.a()) ? e.a() : e.b();
            assertTrue(got.hasDirected(from, e.other(from)), "lost " + e + ": " + got);
        }
    }

    @Test
    @DisplayName("a hand-on that contradicts the run's knowledge, or a start graph a learner cannot use, fails the run with a clear message")
    void runTimeRefusals() {
        MutableGraph chain = Graph.builder(RandomDags.names(3));
        chain.addDirected(0, 1).addDirected(1, 2);
        LearnerInput in = LearnerInput.of(SmallData.linearGaussian(chain.freeze(), 300, 2));
        List<String> v = in.variableNames();
        // A first step that claims to honour required edges but returns the empty graph (as an outside
        // command might): the run's required X1 -> X3 then contradicts the allowed edges it hands on.
        Learner claimsKnowledge = new Learner() {
            private final LearnerDescription d = LearnerDescription.builder("claims-knowledge").summary("empty graph")
                    .publication("test double").family(LearnerFamily.BASELINE).accepts(DataKind.CONTINUOUS)
                    .returns(GraphClass.DAG).knowledge(KnowledgeUse.REQUIRED_EDGES, KnowledgeUse.FORBIDDEN_EDGES).build();

            @Override
            public LearnerDescription description() {
                return d;
            }

            @Override
            public Estimate learn(LearnerInput input, Knowledge knowledge, ParameterValues p, RunContext context) {
                return Estimate.of(Graph.empty(input.variableNames()), GraphClass.DAG);
            }
        };
        Knowledge requireFar = Knowledge.builder().require(v.get(0), v.get(2)).build();
        ComposedLearner c = ComposedLearner.of(List.of(ComposedStep.first(claimsKnowledge),
                new ComposedStep(HC, Handoff.ALLOWED_EDGES)));
        String m = assertThrows(LearnerException.class, () -> learn(c, in, requireFar, Map.of(),
                RunContext.unlimited(1))).getMessage();
        assertTrue(m.startsWith("step 2 (hill-climbing): the allowed-edges of step 1 (claims-knowledge) contradict the"
                + " run's knowledge: edge X1 -> X3 is both required and forbidden"), m);

        MutableGraph bi = Graph.builder(v);
        bi.addBidirected(0, 1);
        m = assertThrows(LearnerException.class, () -> learn(HC, in.withStart(bi.freeze()), Knowledge.none(), Map.of(),
                RunContext.unlimited(1))).getMessage();
        assertTrue(m.startsWith("a start graph may have only directed and undirected edges"), m);
        m = assertThrows(LearnerException.class, () -> learn(new DirectLingamLearner(), in.withStart(chain.freeze()),
                Knowledge.none(), Map.of(), RunContext.unlimited(1))).getMessage();
        assertEquals("learner direct-lingam cannot start from a given graph", m);
    }
}

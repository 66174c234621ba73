package dev.touchstone.learners.score;

import dev.touchstone.core.graph.Graph;
import dev.touchstone.core.graph.GraphClass;
import dev.touchstone.core.learner.DeclaredLearner;
import dev.touchstone.core.learner.Estimate;
import dev.touchstone.core.learner.LearnerDescription;
import dev.touchstone.core.learner.LearnerRun;
import dev.touchstone.core.param.Parameter;
import dev.touchstone.core.param.ParameterValues;
import dev.touchstone.learners.knowledge.KnowledgeIndex;

import java.util.List;
import java.util.Map;

/**
 * Greedy equivalence search (Chickering 2002) with a decomposable local score, returning a
 * CPDAG; with the oracle it scores the exact population covariance with the BIC (see
 * {@link BicScore} for why that is consistent). Method, caching and cost: {@link GesSearch}.
 * Off by default, three additions that can only raise the score reached: repeating the phases
 * until a round makes no move (common practice), a turning phase of edge reversals between
 * classes (Hauser and Bühlmann 2012, "Characterization and greedy learning of interventional
 * Markov equivalence classes of directed acyclic graphs", JMLR 13), and seeded perturbed starts.
 * Stateless and thread-safe.
 */
public final class GesLearner extends DeclaredLearner {

    /** The learner id. */
    public static final String ID = "ges";

    static final String REPEAT_PHASES = "repeat_phases";
    static final String TURNING_PHASE = "turning_phase";
    static final String PERTURBED_STARTS = "perturbed_starts";
    static final String RANDOM_MOVES_PER_START = "random_moves_per_start";

    private static final Parameter<Boolean> REPEAT = Parameter.bool(REPEAT_PHASES, false,
            "run the forward and backward phases (and the turning phase, when on) again until a"
                    + " whole round makes no move");
    private static final Parameter<Boolean> TURNING = Parameter.bool(TURNING_PHASE, false,
            "after the backward phase, reverse edges of the class while that raises the score"
                    + " (turning operator of Hauser and Bühlmann 2012)");
    private static final Parameter<Integer> STARTS = Parameter.integer(PERTURBED_STARTS, 0, 0, 1000,
            "number of further searches, each from the best class so far after random edge"
                    + " additions or removals; the best-scoring class is kept (0: none)");
    private static final Parameter<Integer> MOVES_PER_START = Parameter.integer(RANDOM_MOVES_PER_START, 3, 1, 10000,
            "random edge additions or removals applied before each further search");

    private static final LearnerDescription DESCRIPTION = describe();

    private static LearnerDescription describe() {
        return ScoreSettings.describe(ID,
                        "greedy equivalence search: forward insertions then backward deletions over Markov"
                                + " equivalence classes, maximising a decomposable score; optionally repeated,"
                                + " with a turning phase, and from perturbed starts",
                        "Chickering (2002), Optimal structure identification with greedy search,"
                                + " Journal of Machine Learning Research 3; turning phase after Hauser and"
                                + " Bühlmann (2012), Journal of Machine Learning Research 13",
                        GraphClass.CPDAG)
                .takesStartGraph()
                .assumption("a consistent score and faithfulness for the large-sample guarantee")
                .parameter(REPEAT)
                .parameter(TURNING)
                .parameter(STARTS)
                .parameter(MOVES_PER_START)
                .build();
    }

    static GesSearch.Variants variants(ParameterValues parameters) {
        return new GesSearch.Variants(parameters.get(REPEAT), parameters.get(TURNING), parameters.get(STARTS),
                parameters.get(MOVES_PER_START));
    }

    public GesLearner() {
        super(DESCRIPTION);
    }

    @Override
    protected Estimate run(LearnerRun run) {
        List<String> names = run.names();
        KnowledgeIndex index = KnowledgeIndex.of(run.knowledge(), names);
        LocalScore score = ScoreCache.of(ScoreSettings.build(ID, run.input(), run.parameters()), run.context());
        GesSearch search = new GesSearch(score, index, new CpdagCompletion(names, run.knowledge()),
                run.get(ScoreSettings.PARENT_LIMIT), run.context())
                .variants(variants(run.parameters()));
        Graph cpdag = search.run(StartDag.of(run.input().startGraph(), names, run.knowledge())).toGraph(names);
        return new Estimate(cpdag, GraphClass.CPDAG, Map.of(
                "forward-moves", (double) search.forwardMoves(),
                "backward-moves", (double) search.backwardMoves(),
                "turning-moves", (double) search.turningMoves(),
                "perturbed-starts-improved", (double) search.startsImproved()));
    }
}

package dev.touchstone.learners.score;

import dev.touchstone.core.graph.Graph;
import dev.touchstone.core.graph.GraphClass;
import dev.touchstone.core.learner.DeclaredLearner;
import dev.touchstone.core.learner.Estimate;
import dev.touchstone.core.learner.LearnerDescription;
import dev.touchstone.core.learner.LearnerRun;
import dev.touchstone.core.param.Parameter;
import dev.touchstone.learners.knowledge.KnowledgeIndex;

import java.util.List;
import java.util.Map;

/**
 * Hill climbing over DAGs with a tabu list and seeded restarts, with any of the local scores
 * (see {@link HillClimbSearch} for the method, its sources and its cost). Returns a DAG.
 * The first climb starts from the input's start graph when there is one (see {@link StartDag}),
 * otherwise from the empty graph. Stateless and thread-safe.
 */
public final class HillClimbLearner extends DeclaredLearner {

    /** The learner id. */
    public static final String ID = "hill-climbing";

    static final Parameter<Integer> RECENT_MOVES_BARRED = Parameter.integer("recent_moves_barred", 10, 0, 10000,
            "number of recent moves whose inverse may not be taken (a tabu list, Glover 1989; 0: none)");
    static final Parameter<Integer> PATIENCE = Parameter.integer("patience", 10, 0, 100000,
            "steps without a new best score before a climb ends (0: stop at the first local maximum)");
    static final Parameter<Integer> PERTURBED_STARTS = Parameter.integer("perturbed_starts", 3, 0, 1000,
            "number of further climbs, each from the best DAG so far after random moves");
    static final Parameter<Integer> RANDOM_MOVES_PER_START = Parameter.integer("random_moves_per_start", 5, 1, 10000,
            "random moves applied to the best DAG before each further climb");

    private static final LearnerDescription DESCRIPTION = describe();

    private static LearnerDescription describe() {
        LearnerDescription.Builder b = ScoreSettings.describe(ID,
                        "greedy search over DAGs with edge additions, removals and reversals, a tabu list and"
                                + " seeded random restarts, maximising a decomposable score",
                        "common practice; moves and score updates as in Heckerman, Geiger and Chickering (1995),"
                                + " Machine Learning 20; tabu search after Glover (1989)",
                        GraphClass.DAG)
                .assumption("the DAG returned is one member of its equivalence class; its orientations within"
                        + " the class are not identified by the data")
                .takesStartGraph();
        return b.parameter(RECENT_MOVES_BARRED).parameter(PATIENCE).parameter(PERTURBED_STARTS)
                .parameter(RANDOM_MOVES_PER_START).build();
    }

    public HillClimbLearner() {
        super(DESCRIPTION);
    }

    @Override
    protected Estimate run(LearnerRun run) {
        List<String> names = run.names();
        KnowledgeIndex index = KnowledgeIndex.of(run.knowledge(), names);
        LocalScore score = ScoreCache.of(ScoreSettings.build(ID, run.input(), run.parameters()), run.context());
        HillClimbSearch search = new HillClimbSearch(score, index, run.get(ScoreSettings.PARENT_LIMIT),
                run.get(RECENT_MOVES_BARRED), run.get(PATIENCE), run.get(PERTURBED_STARTS),
                run.get(RANDOM_MOVES_PER_START), run.context());
        Graph dag = search.run(StartDag.of(run.input().startGraph(), names, run.knowledge())).toGraph(names);
        return new Estimate(dag, GraphClass.DAG, Map.of("steps", (double) search.steps()));
    }
}

package dev.touchstone.learners.score;

import dev.touchstone.core.graph.Graph;
import dev.touchstone.core.graph.GraphClass;
import dev.touchstone.core.knowledge.Knowledge;
import dev.touchstone.core.learner.Estimate;
import dev.touchstone.core.learner.Learner;
import dev.touchstone.core.learner.LearnerDescription;
import dev.touchstone.core.learner.LearnerException;
import dev.touchstone.core.learner.LearnerInput;
import dev.touchstone.core.learner.RunContext;
import dev.touchstone.core.param.ParameterSpec;
import dev.touchstone.core.param.ParameterValues;

import java.util.List;
import java.util.Map;

/**
 * Hill climbing over DAGs with a tabu list and seeded restarts, with any of the local scores
 * (see {@link HillClimbSearch} for the method, its sources and its cost). Returns a DAG.
 * The first climb starts from the input's start graph when there is one (see {@link StartDag}),
 * otherwise from the empty graph. Stateless and thread-safe.
 */
public final class HillClimbLearner implements Learner {

    /** The learner id. */
    public static final String ID = "hill-climbing";

    static final String RECENT_MOVES_BARRED = "recent_moves_barred";
    static final String PATIENCE = "patience";
    static final String PERTURBED_STARTS = "perturbed_starts";
    static final String RANDOM_MOVES_PER_START = "random_moves_per_start";

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
        b.parameter(ParameterSpec.integer(RECENT_MOVES_BARRED, 10, 0, 10000,
                "number of recent moves whose inverse may not be taken (a tabu list, Glover 1989; 0: none)"));
        b.parameter(ParameterSpec.integer(PATIENCE, 10, 0, 100000,
                "steps without a new best score before a climb ends (0: stop at the first local maximum)"));
        b.parameter(ParameterSpec.integer(PERTURBED_STARTS, 3, 0, 1000,
                "number of further climbs, each from the best DAG so far after random moves"));
        b.parameter(ParameterSpec.integer(RANDOM_MOVES_PER_START, 5, 1, 10000,
                "random moves applied to the best DAG before each further climb"));
        return b.build();
    }

    @Override
    public LearnerDescription description() {
        return DESCRIPTION;
    }

    @Override
    public Estimate learn(LearnerInput input, Knowledge knowledge, ParameterValues parameters, RunContext context) {
        DESCRIPTION.checkAccepts(input);
        context.checkDeadline();
        List<String> names = input.variableNames();
        KnowledgeIndex index = indexKnowledge(knowledge, names);
        LocalScore score = ScoreCache.of(ScoreSettings.build(ID, input, parameters), context);
        HillClimbSearch search = new HillClimbSearch(score, index, ScoreSettings.maxParents(parameters),
                parameters.getInt(RECENT_MOVES_BARRED), parameters.getInt(PATIENCE), parameters.getInt(PERTURBED_STARTS),
                parameters.getInt(RANDOM_MOVES_PER_START), context);
        Graph dag = search.run(StartDag.of(input.startGraph(), names, knowledge)).toGraph(names);
        return new Estimate(dag, GraphClass.DAG, Map.of("steps", (double) search.steps()));
    }

    static KnowledgeIndex indexKnowledge(Knowledge knowledge, List<String> names) {
        try {
            return KnowledgeIndex.of(knowledge, names);
        } catch (IllegalArgumentException e) {
            throw new LearnerException(e.getMessage(), e);
        }
    }
}

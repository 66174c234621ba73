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
 * Stateless and thread-safe.
 */
public final class HillClimbLearner implements Learner {

    /** The learner id. */
    public static final String ID = "hill-climbing";

    static final String TABU_LENGTH = "tabu_length";
    static final String PATIENCE = "patience";
    static final String RESTARTS = "restarts";
    static final String PERTURBATION = "perturbation";

    private static final LearnerDescription DESCRIPTION = describe();

    private static LearnerDescription describe() {
        LearnerDescription.Builder b = ScoreSettings.describe(ID,
                        "greedy search over DAGs with edge additions, removals and reversals, a tabu list and"
                                + " seeded random restarts, maximising a decomposable score",
                        "common practice; moves and score updates as in Heckerman, Geiger and Chickering (1995),"
                                + " Machine Learning 20; tabu search after Glover (1989)",
                        GraphClass.DAG)
                .assumption("the DAG returned is one member of its equivalence class; its orientations within"
                        + " the class are not identified by the data");
        b.parameter(ParameterSpec.integer(TABU_LENGTH, 10, 0, 10000,
                "number of recent moves whose inverse may not be taken (0: no tabu list)"));
        b.parameter(ParameterSpec.integer(PATIENCE, 10, 0, 100000,
                "steps without a new best score before a climb ends (0: stop at the first local maximum)"));
        b.parameter(ParameterSpec.integer(RESTARTS, 3, 0, 1000,
                "number of restarts from a randomly perturbed best DAG"));
        b.parameter(ParameterSpec.integer(PERTURBATION, 5, 1, 10000,
                "random moves applied to the best DAG at each restart"));
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
                parameters.getInt(TABU_LENGTH), parameters.getInt(PATIENCE), parameters.getInt(RESTARTS),
                parameters.getInt(PERTURBATION), context);
        Graph dag = search.run().toGraph(names);
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

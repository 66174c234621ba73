package dev.touchstone.learners.score;

import dev.touchstone.core.graph.Graph;
import dev.touchstone.core.graph.GraphClass;
import dev.touchstone.core.knowledge.Knowledge;
import dev.touchstone.core.learner.Estimate;
import dev.touchstone.core.learner.Learner;
import dev.touchstone.core.learner.LearnerDescription;
import dev.touchstone.core.learner.LearnerInput;
import dev.touchstone.core.learner.RunContext;
import dev.touchstone.core.param.ParameterValues;

import java.util.List;
import java.util.Map;

/**
 * Greedy equivalence search (Chickering 2002) with a decomposable local score, returning a
 * CPDAG; with the oracle it scores the exact population covariance with the BIC (see
 * {@link BicScore} for why that is consistent). Method, caching and cost: {@link GesSearch}.
 * Stateless and thread-safe.
 */
public final class GesLearner implements Learner {

    /** The learner id. */
    public static final String ID = "ges";

    private static final LearnerDescription DESCRIPTION = describe();

    private static LearnerDescription describe() {
        return ScoreSettings.describe(ID,
                        "greedy equivalence search: forward insertions then backward deletions over Markov"
                                + " equivalence classes, maximising a decomposable score",
                        "Chickering (2002), Optimal structure identification with greedy search,"
                                + " Journal of Machine Learning Research 3",
                        GraphClass.CPDAG)
                .assumption("a consistent score and faithfulness for the large-sample guarantee")
                .build();
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
        KnowledgeIndex index = HillClimbLearner.indexKnowledge(knowledge, names);
        LocalScore score = ScoreCache.of(ScoreSettings.build(ID, input, parameters), context);
        GesSearch search = new GesSearch(score, index, new CpdagCompletion(names, knowledge),
                ScoreSettings.maxParents(parameters), context);
        Graph cpdag = search.run().toGraph(names);
        return new Estimate(cpdag, GraphClass.CPDAG, Map.of(
                "forward-moves", (double) search.forwardMoves(),
                "backward-moves", (double) search.backwardMoves()));
    }
}

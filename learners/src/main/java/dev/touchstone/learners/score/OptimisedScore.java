package dev.touchstone.learners.score;

import dev.touchstone.core.graph.Graph;
import dev.touchstone.core.graph.GraphClass;
import dev.touchstone.core.graph.algorithms.DagExtension;
import dev.touchstone.core.knowledge.Knowledge;
import dev.touchstone.core.learner.Learner;
import dev.touchstone.core.learner.LearnerDescription;
import dev.touchstone.core.learner.LearnerFamily;
import dev.touchstone.core.learner.LearnerInput;
import dev.touchstone.core.learner.RunContext;
import dev.touchstone.core.param.ParameterSpec;
import dev.touchstone.core.param.ParameterValues;
import dev.touchstone.learners.knowledge.KnowledgeIndex;

import java.util.HashSet;
import java.util.List;
import java.util.Optional;
import java.util.Set;

/**
 * The decomposable score one run of a built-in score-based learner maximised (its own score
 * settings on its own input), for judging that run afterwards: the score of any DAG or of a
 * member DAG of a CPDAG (all members score alike under the score-equivalent BIC, EBIC and
 * BDeu: Chickering 1995; Heckerman, Geiger and Chickering 1995), and the exact optimum within
 * the run's parent limit and knowledge by dynamic programming over subsets (Silander and
 * Myllymäki 2006; {@link ExactSearch}) where the variables are few enough. Immutable.
 */
public final class OptimisedScore {

    /** The most variables for which {@link #optimum} searches without a parent limit (about a second). */
    public static final int OPTIMUM_VARIABLES = 16;
    /** The most variables for which {@link #optimum} searches with a parent limit of at most 4. */
    public static final int OPTIMUM_VARIABLES_LIMITED = 20;

    /** An optimal DAG and its score. */
    public record Optimum(Graph dag, double score) {
    }

    private final LocalScore score;
    private final Knowledge knowledge;
    private final int parentLimit;
    private final List<String> names;

    private OptimisedScore(LocalScore score, Knowledge knowledge, int parentLimit, List<String> names) {
        this.score = score;
        this.knowledge = knowledge;
        this.parentLimit = parentLimit;
        this.names = names;
    }

    /**
     * The score this learner maximised on this input with these parameters, or empty when the
     * learner is not a score-based learner declaring the shared score parameters (its score is
     * then not known here).
     *
     * @throws dev.touchstone.core.learner.LearnerException when the settings do not fit the input (as the run itself would)
     */
    public static Optional<OptimisedScore> of(Learner learner, LearnerInput input, ParameterValues values,
                                              Knowledge knowledge) {
        LearnerDescription d = learner.description();
        if (d.family() != LearnerFamily.SCORE || !declaresScoreSettings(d)) {
            return Optional.empty();
        }
        return Optional.of(new OptimisedScore(ScoreSettings.build(d.id(), input, values), knowledge,
                values.get(ScoreSettings.PARENT_LIMIT), input.variableNames()));
    }

    private static boolean declaresScoreSettings(LearnerDescription d) {
        Set<String> declared = new HashSet<>();
        for (ParameterSpec s : d.parameters()) {
            declared.add(s.name());
        }
        for (ParameterSpec s : ScoreSettings.specs()) {
            if (!declared.contains(s.name())) {
                return false;
            }
        }
        return true;
    }

    /**
     * The score of a DAG, or of a consistent extension of a CPDAG (Dor and Tarsi 1992), over
     * the input's variables; empty for a graph of another class, over other variables, or a
     * PDAG without an extension.
     */
    public Optional<Double> of(Graph graph, GraphClass graphClass) {
        if (!graph.names().equals(names) || graph.hasHidden()) {
            return Optional.empty();
        }
        Graph dag;
        if (graphClass == GraphClass.DAG) {
            dag = graph;
        } else if (graphClass == GraphClass.CPDAG) {
            dag = DagExtension.of(graph);
            if (dag == null) {
                return Optional.empty();
            }
        } else {
            return Optional.empty();
        }
        double s = 0;
        for (int v = 0; v < dag.size(); v++) {
            s += score.localScore(v, dag.parents(v));
        }
        return Optional.of(s);
    }

    /** Whether {@link #optimum} searches on this many variables with this run's parent limit. */
    public boolean optimumWithinReach() {
        boolean narrow = parentLimit >= 0 && parentLimit <= ExactScoreLearner.WIDE_LIMIT;
        return names.size() <= (narrow ? OPTIMUM_VARIABLES_LIMITED : OPTIMUM_VARIABLES);
    }

    /**
     * An optimal DAG under the run's parent limit and knowledge, or empty beyond reach
     * ({@link #optimumWithinReach}) or when no DAG satisfies the knowledge within the limit.
     */
    public Optional<Optimum> optimum(RunContext context) {
        if (!optimumWithinReach()) {
            return Optional.empty();
        }
        KnowledgeIndex index = KnowledgeIndex.of(knowledge, names);
        ExactSearch search = new ExactSearch(score, index, parentLimit, context);
        try {
            int[] parents = search.run();
            return Optional.of(new Optimum(ExactScoreLearner.dagOf(parents, names), search.optimum()));
        } catch (IllegalStateException e) {
            return Optional.empty();
        }
    }
}

package dev.touchstone.learners.composed;

import dev.touchstone.core.graph.Edge;
import dev.touchstone.core.graph.Graph;
import dev.touchstone.core.graph.GraphClass;
import dev.touchstone.core.knowledge.Knowledge;
import dev.touchstone.core.learner.KnowledgeUse;
import dev.touchstone.core.learner.LearnerDescription;
import dev.touchstone.core.learner.LearnerInput;
import dev.touchstone.core.param.Worded;

import java.util.List;

/**
 * How a step of a {@link ComposedLearner} receives the estimate of the step before it.
 *
 * <p>Restricting a score search to the skeleton a constraint-based search found is the
 * hybrid scheme of MMHC (Tsamardinos, Brown and Aliferis 2006, "The max-min hill-climbing
 * Bayesian network structure learning algorithm", Machine Learning 65; from memory); required
 * edges and a starting graph are the other two ways background knowledge and search
 * initialisation can carry one estimate into another search (common practice).
 */
public enum Handoff implements Worded {
    /** The previous estimate's adjacencies are the only edges allowed: every other pair is forbidden both ways. */
    ALLOWED_EDGES("the adjacencies of"),
    /** The previous estimate's directed edges are required (the previous step must return a DAG). */
    REQUIRED_EDGES("the edges of"),
    /** The search starts from the previous estimate. */
    START_GRAPH("a start at");

    private final String phrase;

    Handoff(String phrase) {
        this.phrase = phrase;
    }

    /** The allowed words, for messages. */
    public static List<String> words() {
        return Worded.words(Handoff.class);
    }

    /** The hand-on named by a word, or null. */
    public static Handoff of(String word) {
        return Worded.find(Handoff.class, word).orElse(null);
    }

    /** How a summary says what a step receives, e.g. "the adjacencies of". */
    String phrase() {
        return phrase;
    }

    /**
     * Why {@code receiver} cannot be given the estimate of {@code giver} this way, or null when it can.
     * Only what the descriptions show is checked here; what depends on the estimate is checked when it is handed on.
     */
    public String refusal(LearnerDescription giver, LearnerDescription receiver) {
        switch (this) {
            case ALLOWED_EDGES:
                return receiver.knowledge().contains(KnowledgeUse.FORBIDDEN_EDGES) ? null
                        : "learner " + receiver.id() + " does not honour forbidden edges, so it cannot be given "
                        + word();
            case REQUIRED_EDGES:
                if (!receiver.knowledge().contains(KnowledgeUse.REQUIRED_EDGES)) {
                    return "learner " + receiver.id() + " does not honour required edges, so it cannot be given "
                            + word();
                }
                return giver.returns() == GraphClass.DAG ? null
                        : word() + " needs the step before to return a dag, and " + giver.id() + " returns a "
                        + giver.returns().word() + ": knowledge can require only directed edges";
            default:
                return receiver.takesStartGraph() ? null
                        : "learner " + receiver.id() + " cannot start from a given graph, so it cannot be given "
                        + word();
        }
    }

    /** The knowledge the receiving step gets: {@code base} with what this hand-on adds from {@code previous}. */
    Knowledge knowledge(Knowledge base, Graph previous) {
        if (this == START_GRAPH) {
            return base;
        }
        Knowledge.Builder b = base.toBuilder();
        if (this == ALLOWED_EDGES) {
            for (int x = 0; x < previous.size(); x++) {
                for (int y = x + 1; y < previous.size(); y++) {
                    if (!previous.adjacent(x, y)) {
                        b.forbid(previous.name(x), previous.name(y));
                        b.forbid(previous.name(y), previous.name(x));
                    }
                }
            }
        } else {
            for (Edge e : previous.edges()) {
                int from = e.tail();
                b.require(previous.name(from), previous.name(e.other(from)));
            }
        }
        return b.build();
    }

    /** The input the receiving step gets: {@code input}, with {@code previous} as its start graph for {@link #START_GRAPH}. */
    LearnerInput input(LearnerInput input, Graph previous) {
        return this == START_GRAPH ? input.withStart(previous) : input;
    }
}

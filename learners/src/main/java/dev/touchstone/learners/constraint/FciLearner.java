package dev.touchstone.learners.constraint;

import dev.touchstone.core.graph.Graph;
import dev.touchstone.core.graph.GraphClass;
import dev.touchstone.core.graph.Mark;
import dev.touchstone.core.graph.MutableGraph;
import dev.touchstone.core.graph.algorithms.PagRules;
import dev.touchstone.core.graph.algorithms.SeparationInfo;
import dev.touchstone.core.knowledge.Knowledge;
import dev.touchstone.core.learner.DeclaredLearner;
import dev.touchstone.core.learner.Estimate;
import dev.touchstone.core.learner.LearnerDescription;
import dev.touchstone.core.learner.LearnerRun;
import dev.touchstone.core.learner.RunContext;
import dev.touchstone.core.param.Parameter;
import dev.touchstone.learners.independence.IndependenceTest;
import dev.touchstone.learners.knowledge.KnowledgeIndex;

import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;

/**
 * FCI, the Fast Causal Inference algorithm (Spirtes, Glymour and Scheines 2000, "Causation,
 * Prediction, and Search", 2nd ed., §6.7; Spirtes, Meek and Richardson 1999), with the
 * complete orientation rules of Zhang (2008, "On the completeness of orientation rules for
 * causal discovery in the presence of latent confounders and selection bias", Artificial
 * Intelligence 172). It returns a partial ancestral graph (PAG) over the observed variables
 * and allows hidden common causes.
 *
 * <p>Steps: (1) the PC adjacency search ({@link AdjacencySearch}, sequential or
 * order-independent); (2) every edge ∘–∘, then R0: an unshielded triple a ∗–∗ b ∗–∗ c
 * with b outside the recorded separating set of a and c becomes a ∗→ b ←∗ c; (3) the
 * Possible-D-Sep step ({@link PossibleDsepSearch}) removes edges the neighbourhoods could not
 * separate; (4) every edge back to ∘–∘, knowledge marks ({@link PagKnowledge}), R0 again
 * with the separating sets of both phases; (5) core's {@link PagRules} R1–R4 and R8–R10
 * (or all of R1–R10 with {@code selection_bias = possible}) to closure, R4 asking the
 * separating sets about discriminating paths. With the d-separation oracle this is exactly
 * the PAG core builds from the latent projection ({@code Pags.of}; Zhang 2008, Theorem 4
 * as cited from memory; checked in the tests).
 *
 * <p>Knowledge ({@link PagKnowledge}): required pairs are never tested and end as required;
 * pairs forbidden both ways are tested like the others (as in PC) and removed after the Possible-D-Sep step, so that a separating set is known
 * whenever the tests find one. Only a forbidden pair the tests leave adjacent has none; its
 * triples then count as non-colliders in R0 and R4.
 *
 * <p>Cost: the adjacency search as in PC, then the Possible-D-Sep tests, exponential in the
 * size of Possible-D-Sep (bounded by {@code max_depth} and {@code possible_dsep_length}),
 * then the rules (see {@link PagRules}). Stateless and thread-safe.
 */
public final class FciLearner extends DeclaredLearner {

    static final Parameter<Boolean> POSSIBLE_DSEP = Parameter.bool("possible_dsep", true,
            "run the Possible-D-Sep step that removes edges no subset of the neighbours separates "
                    + "(off: the PC skeleton is kept; faster, not complete)");
    static final Parameter<Integer> POSSIBLE_DSEP_LENGTH = Parameter.integer("possible_dsep_length", -1, -1, 1000,
            "longest path followed when building Possible-D-Sep; -1 for no limit");
    static final Parameter<SelectionBias> SELECTION_BIAS = Parameter.choice("selection_bias", SelectionBias.ABSENT,
            "absent: rules R1-R4 and R8-R10 (complete without selection bias); "
                    + "possible: all of R1-R10 (Zhang 2008)");

    private static final LearnerDescription DESCRIPTION = describe();

    private static LearnerDescription describe() {
        LearnerDescription.Builder b = ConstraintParameters.describe("fci", GraphClass.PAG)
                .summary("FCI: PC adjacency search, Possible-D-Sep step and Zhang's complete orientation rules;"
                        + " returns a PAG and allows hidden common causes")
                .publication("Spirtes, Glymour and Scheines (2000), Causation, Prediction, and Search, 2nd ed.;"
                        + " Zhang (2008), Artificial Intelligence 172; Colombo et al. (2012), Annals of Statistics 40")
                .assumption("acyclic causal structure over observed and hidden variables")
                .assumption("causal Markov condition and faithfulness")
                .assumption("hidden common causes allowed; selection bias only with selection_bias = possible")
                .assumption("the independence test fits the data (e.g. Gaussian for fisher-z)");
        return ConstraintParameters.build(b, POSSIBLE_DSEP, POSSIBLE_DSEP_LENGTH, SELECTION_BIAS);
    }

    public FciLearner() {
        super(DESCRIPTION);
    }

    @Override
    protected Estimate run(LearnerRun run) {
        RunContext context = run.context();
        SearchInputs in = SearchInputs.read(run);
        List<String> names = in.names();
        KnowledgeIndex ki = in.knowledge();
        IndependenceTest test = in.test();
        int maxDepth = in.maxDepth();
        // Pairs forbidden by knowledge are tested like any other and removed only after Possible-D-Sep, so
        // that their separating sets are known: guessing "non-collider" for them would let R1 put wrong tails.
        Skeleton skeleton = new AdjacencySearch(test, ki, in.variant(), maxDepth, context).searchKeepingForbidden();
        PagRules rules = run.get(SELECTION_BIAS).rules();
        // Knowledge-removed pairs have no separating set: their triples count as non-colliders.
        SeparationInfo info = SeparationInfo.fromSeparatingSets(
                (x, y, v) -> skeleton.sepset(x, y) == null || skeleton.sepsetContains(x, y, v));
        int removed = 0;
        if (run.get(POSSIBLE_DSEP)) {
            MutableGraph first = circles(names, skeleton);
            PagKnowledge.apply(first, ki);
            rules.orientColliders(first, info);
            context.checkDeadline();
            removed = new PossibleDsepSearch(test, ki, maxDepth,
                    run.get(POSSIBLE_DSEP_LENGTH), context).run(skeleton, first);
        }
        AdjacencySearch.removeForbidden(skeleton, ki);
        MutableGraph g = circles(names, skeleton);
        PagKnowledge.apply(g, ki);
        rules.orientColliders(g, info);
        context.checkDeadline();
        rules.close(g, info, context::checkDeadline);
        Map<String, Double> extras = new LinkedHashMap<>();
        extras.put("possible_dsep_removed", (double) removed);
        extras.put("circle_marks", (double) circleMarks(g));
        return new Estimate(g.freeze(), GraphClass.PAG, extras);
    }

    /** The skeleton's adjacencies as edges ∘–∘ (also RFCI's starting graph). */
    static MutableGraph circles(List<String> names, Skeleton s) {
        MutableGraph g = Graph.builder(names);
        for (int a = 0; a < s.size(); a++) {
            for (int b : s.neighbours(a)) {
                if (a < b) {
                    g.addEdge(a, b, Mark.CIRCLE, Mark.CIRCLE);
                }
            }
        }
        return g;
    }

    /** The number of circle marks left, reported by FCI and RFCI as how much stays unoriented. */
    static int circleMarks(MutableGraph g) {
        int n = 0;
        for (int a = 0; a < g.size(); a++) {
            for (int b : g.neighbours(a)) {
                if (g.markAt(a, b) == Mark.CIRCLE) {
                    n++;
                }
            }
        }
        return n;
    }
}

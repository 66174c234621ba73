package dev.touchstone.learners.constraint;

import dev.touchstone.core.graph.GraphClass;
import dev.touchstone.core.graph.MutableGraph;
import dev.touchstone.core.graph.algorithms.PagRules;
import dev.touchstone.core.learner.DeclaredLearner;
import dev.touchstone.core.learner.Estimate;
import dev.touchstone.core.learner.LearnerDescription;
import dev.touchstone.core.learner.LearnerRun;
import dev.touchstone.core.learner.RunContext;
import dev.touchstone.learners.knowledge.KnowledgeIndex;

import java.util.Arrays;
import java.util.LinkedHashMap;
import java.util.Map;

/**
 * RFCI, the Really Fast Causal Inference algorithm (Colombo, Maathuis, Kalisch and Richardson
 * 2012, "Learning high-dimensional directed acyclic graphs with latent and selection
 * variables", Annals of Statistics 40). It returns a PAG over the observed variables, allows
 * hidden common causes, and skips FCI's Possible-D-Sep step, whose tests grow exponentially with
 * the size of Possible-D-Sep; in its place come a few tests on unshielded triples and on
 * discriminating paths ({@link RfciChecks}).
 *
 * <p>Steps: (1) the PC adjacency search ({@link AdjacencySearch}, as in FCI); (2) the
 * unshielded-triple check, which may remove edges; (3) every edge ∘–∘, knowledge marks, R0 from
 * the separating sets; (4) Zhang's rules to closure as in FCI ({@link PagRules}), R4 asking the
 * discriminating-path check; when that check separates two consecutive vertices of a path,
 * their edge is removed, the triples it unshields are checked, and (3)–(4) start again on the
 * smaller skeleton. Each restart removes an edge, so there are at most as many as edges.
 *
 * <p>What it guarantees with a perfect oracle (Colombo et al. 2012, Theorem 3.4 and the
 * definition of an RFCI-PAG, from memory): every edge removed is separated in the truth, so the
 * skeleton contains that of the true MAG (it may keep edges FCI removes); every arrowhead and
 * tail is sound (an arrowhead at b on a *→ b: b is no ancestor of a; a tail at a: a is an
 * ancestor of b); when the skeleton is the MAG's, the output is FCI's, the true PAG. Without
 * hidden variables the PC skeleton is already right and RFCI equals FCI. Knowledge as in FCI.
 *
 * <p>Cost: the adjacency search as in PC, then two tests per collider candidate and a few per
 * discriminating path, polynomial for sparse truths; each restart repeats the rules. Stateless
 * and thread-safe.
 */
public final class RfciLearner extends DeclaredLearner {

    private static final LearnerDescription DESCRIPTION = describe();

    private static LearnerDescription describe() {
        LearnerDescription.Builder b = ConstraintParameters.describe("rfci", GraphClass.PAG)
                .summary("RFCI: PC adjacency search, then tests on unshielded triples and discriminating paths in"
                        + " place of Possible-D-Sep, and Zhang's orientation rules; returns a PAG, allows hidden"
                        + " common causes, may be less informative than FCI")
                .publication("Colombo, Maathuis, Kalisch and Richardson (2012), Learning high-dimensional directed"
                        + " acyclic graphs with latent and selection variables, Annals of Statistics 40;"
                        + " rules of Zhang (2008), Artificial Intelligence 172")
                .assumption("acyclic causal structure over observed and hidden variables")
                .assumption("causal Markov condition and faithfulness")
                .assumption("hidden common causes allowed; selection bias only with selection_bias = possible")
                .assumption("the independence test fits the data (e.g. Gaussian for fisher-z)");
        return ConstraintParameters.build(b, FciLearner.SELECTION_BIAS);
    }

    public RfciLearner() {
        super(DESCRIPTION);
    }

    @Override
    protected Estimate run(LearnerRun run) {
        RunContext context = run.context();
        SearchInputs in = SearchInputs.read(run);
        KnowledgeIndex ki = in.knowledge();
        // Forbidden pairs stay until the triple check has run, so that their separating sets are known (as in FCI).
        Skeleton skeleton = new AdjacencySearch(in.test(), ki, in.variant(), in.maxDepth(), context)
                .searchKeepingForbidden();
        PagRules rules = run.get(FciLearner.SELECTION_BIAS).rules();
        RfciChecks checks = new RfciChecks(in.test(), ki, skeleton, context);
        MutableGraph g;
        int restarts = 0;
        try {
            checks.checkAllTriples();
            AdjacencySearch.removeForbidden(skeleton, ki);
            while (true) {
                context.checkDeadline();
                g = FciLearner.circles(in.names(), skeleton);
                PagKnowledge.apply(g, ki);
                RfciChecks.PathCheck info = checks.pathCheck();
                rules.orientColliders(g, info);
                rules.close(g, info, context::checkDeadline);
                int[] removal = info.pendingRemoval();
                if (removal == null) {
                    break;
                }
                checks.removeFromPath(removal[0], removal[1], Arrays.copyOfRange(removal, 2, removal.length));
                restarts++;
            }
        } finally {
            context.countTests(checks.tests());
        }
        Map<String, Double> extras = new LinkedHashMap<>();
        extras.put("triple_check_removed", (double) checks.tripleRemovals());
        extras.put("path_check_removed", (double) checks.pathRemovals());
        extras.put("orientation_restarts", (double) restarts);
        extras.put("circle_marks", (double) FciLearner.circleMarks(g));
        return new Estimate(g.freeze(), GraphClass.PAG, extras);
    }
}

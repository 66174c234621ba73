package dev.touchstone.learners.constraint;

import dev.touchstone.core.graph.Graph;
import dev.touchstone.core.graph.GraphClass;
import dev.touchstone.core.graph.MutableGraph;
import dev.touchstone.core.graph.algorithms.Ancestry;
import dev.touchstone.core.graph.algorithms.DagExtension;
import dev.touchstone.core.graph.algorithms.PagRules;
import dev.touchstone.core.graph.algorithms.SeparationInfo;
import dev.touchstone.core.knowledge.Knowledge;
import dev.touchstone.core.learner.Estimate;
import dev.touchstone.core.learner.LearnerException;
import dev.touchstone.core.learner.LearnerInput;
import dev.touchstone.core.learner.RunContext;
import dev.touchstone.core.param.ParameterSpec;
import dev.touchstone.core.param.ParameterValues;
import dev.touchstone.core.random.Seeds;
import dev.touchstone.learners.independence.IndependenceTest;
import dev.touchstone.learners.independence.IndependenceTests;
import dev.touchstone.learners.knowledge.KnowledgeIndex;

import java.util.ArrayList;
import java.util.HashMap;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;

/**
 * FCI's steps started from the adjacencies and colliders of a score-based CPDAG instead of the
 * complete graph: the constraint half of GFCI (Ogarrio, Spirtes and Ramsey 2016, "A hybrid causal
 * search algorithm for latent variable models", PGM; steps from memory). Public so that the
 * hybrid learner, which runs the score search, can reuse FCI's package-private parts.
 *
 * <p>Steps: (1) every adjacency of the CPDAG G is tested, level by level, given the subsets of
 * the current neighbours of either end, and removed with its separating set when one separates
 * (FCI's adjacency phase, on G's adjacencies only); (2) every edge ∘–∘, knowledge marks, then an
 * unshielded triple a *-* b *-* c becomes a collider when it is one in G (a → b ← c, a and c not
 * adjacent in G), or, when a and c were adjacent in G and a test removed the edge, when b is
 * outside their separating set; (3) FCI's Possible-D-Sep step ({@link PossibleDsepSearch}); (4)
 * every edge ∘–∘ again, knowledge, the colliders of (2), and Zhang's rules to closure.
 *
 * <p>Rule R4 needs a separating set of θ and c; when they were not adjacent in G none was
 * recorded, and one is taken from G: in a DAG extension of G, the parents of whichever of the two
 * comes later in the DAG's order separate them in every distribution G is an I-map of. The set is
 * tested first; if the test disagrees, the subsets of the neighbours of θ and of c are searched
 * (up to {@code max_depth}), and a pair without any set counts as a non-collider, as pairs removed
 * by knowledge do in FCI. Lookups are cached per pair.
 *
 * <p>Cost: the tests of (1) are those of PC's adjacency search restricted to G's edges, so for a
 * sparse G far fewer than from the complete graph; then Possible-D-Sep and the rules as in FCI.
 * Not thread-safe per call; the class itself is stateless.
 */
public final class FciFromAdjacencies {

    private FciFromAdjacencies() {
    }

    /**
     * The declarations the constraint half reads: the test's, {@code max_depth}, and FCI's
     * Possible-D-Sep and selection-bias settings.
     */
    public static List<ParameterSpec> parameters() {
        List<ParameterSpec> specs = new ArrayList<>(ConstraintParameters.testParameters());
        specs.add(ConstraintParameters.MAX_DEPTH.spec());
        specs.add(FciLearner.POSSIBLE_DSEP.spec());
        specs.add(FciLearner.POSSIBLE_DSEP_LENGTH.spec());
        specs.add(FciLearner.SELECTION_BIAS.spec());
        return List.copyOf(specs);
    }

    /**
     * Runs the steps on {@code cpdag}, a CPDAG over the input's variables in the same order.
     *
     * @param values values of at least {@link #parameters()}
     * @return a PAG, with the numbers of edges each step removed as extras
     */
    public static Estimate run(Graph cpdag, LearnerInput input, Knowledge knowledge, ParameterValues values,
                               RunContext context) {
        List<String> names = input.variableNames();
        if (!cpdag.names().equals(names)) {
            throw new IllegalArgumentException("the CPDAG must be over " + names + ", got " + cpdag.names());
        }
        Graph dag = DagExtension.of(cpdag);
        if (dag == null) {
            throw new LearnerException("the score search returned a graph with no DAG extension: " + cpdag);
        }
        KnowledgeIndex ki = KnowledgeIndex.of(knowledge, names);
        IndependenceTest test = IndependenceTests.forInput(input, values,
                Seeds.derive(context.seed(), "independence-test"));
        int maxDepth = values.get(ConstraintParameters.MAX_DEPTH);
        SubsetSearch search = new SubsetSearch(test);
        Skeleton skeleton = new Skeleton(names.size());
        int removedByTests;
        int removedByPossibleDsep = 0;
        MutableGraph g;
        try {
            for (int a = 0; a < names.size(); a++) {
                for (int b = a + 1; b < names.size(); b++) {
                    if (!cpdag.adjacent(a, b)) {
                        skeleton.remove(a, b, null);
                    }
                }
            }
            removedByTests = prune(skeleton, ki, search, maxDepth < 0 ? Integer.MAX_VALUE : maxDepth, context);
            PagRules rules = values.get(FciLearner.SELECTION_BIAS).rules();
            Colliders info = new Colliders(cpdag, dag, skeleton, search, maxDepth);
            if (values.get(FciLearner.POSSIBLE_DSEP)) {
                MutableGraph first = FciLearner.circles(names, skeleton);
                PagKnowledge.apply(first, ki);
                rules.orientColliders(first, info);
                context.checkDeadline();
                removedByPossibleDsep = new PossibleDsepSearch(test, ki, maxDepth,
                        values.get(FciLearner.POSSIBLE_DSEP_LENGTH), context).run(skeleton, first);
            }
            AdjacencySearch.removeForbidden(skeleton, ki);
            g = FciLearner.circles(names, skeleton);
            PagKnowledge.apply(g, ki);
            rules.orientColliders(g, info);
            context.checkDeadline();
            rules.close(g, info, context::checkDeadline);
        } finally {
            context.countTests(search.tests());
        }
        Map<String, Double> extras = new LinkedHashMap<>();
        extras.put("score_adjacencies", (double) cpdag.edgeCount());
        extras.put("test_removed", (double) removedByTests);
        extras.put("possible_dsep_removed", (double) removedByPossibleDsep);
        extras.put("circle_marks", (double) FciLearner.circleMarks(g));
        return new Estimate(g.freeze(), GraphClass.PAG, extras);
    }

    /** Step (1): FCI's adjacency phase on the edges left in {@code s}; returns how many it removed. */
    private static int prune(Skeleton s, KnowledgeIndex ki, SubsetSearch search, int maxDepth, RunContext context) {
        int removed = 0;
        for (int level = 0; level <= maxDepth; level++) {
            boolean any = false;
            for (int x = 0; x < s.size(); x++) {
                for (int y : s.neighbours(x)) {
                    context.checkDeadline();
                    if (y < x || !s.adjacent(x, y) || ki.isRequiredEitherWay(x, y)) {
                        continue;
                    }
                    int[] fromX = AdjacencySearch.without(s.neighbours(x), y);
                    int[] fromY = AdjacencySearch.without(s.neighbours(y), x);
                    if (fromX.length < level && fromY.length < level) {
                        continue;
                    }
                    any = true;
                    int[] sep = search.find(x, y, fromX, fromX.length, level);
                    if (sep == null) {
                        sep = search.find(x, y, fromY, fromY.length, level);
                    }
                    if (sep != null) {
                        s.remove(x, y, sep);
                        removed++;
                    }
                }
            }
            if (!any) {
                break;
            }
        }
        return removed;
    }

    /** The collider answers of steps (2) and (4); see the class comment. */
    private static final class Colliders implements SeparationInfo {
        private final Graph cpdag;
        private final Graph dag;
        private final int[] position;
        private final Skeleton skeleton;
        private final SubsetSearch search;
        private final int maxDepth;
        private final Map<Long, int[]> fromScore = new HashMap<>();

        Colliders(Graph cpdag, Graph dag, Skeleton skeleton, SubsetSearch search, int maxDepth) {
            this.cpdag = cpdag;
            this.dag = dag;
            this.skeleton = skeleton;
            this.search = search;
            this.maxDepth = maxDepth < 0 ? Integer.MAX_VALUE : maxDepth;
            this.position = new int[dag.size()];
            int[] order = Ancestry.topologicalOrder(dag);
            for (int i = 0; i < order.length; i++) {
                position[order[i]] = i;
            }
        }

        @Override
        public boolean unshieldedCollider(int a, int b, int c) {
            if (!cpdag.adjacent(a, c)) {
                return cpdag.hasDirected(a, b) && cpdag.hasDirected(c, b);
            }
            return skeleton.sepset(a, c) != null && !skeleton.sepsetContains(a, c, b);
        }

        @Override
        public boolean discriminatedCollider(int theta, int a, int b, int c) {
            int[] set = cpdag.adjacent(theta, c) ? skeleton.sepset(theta, c) : scoreSepset(theta, c);
            if (set == null) {
                return false;
            }
            for (int v : set) {
                if (v == b) {
                    return false;
                }
            }
            return true;
        }

        /** A separating set of x and y, not adjacent in the CPDAG, read from the DAG and tested; null if none. */
        private int[] scoreSepset(int x, int y) {
            long key = (long) Math.min(x, y) * dag.size() + Math.max(x, y);
            if (fromScore.containsKey(key)) {
                return fromScore.get(key);
            }
            int later = position[x] > position[y] ? x : y;
            int[] parents = dag.parents(later);
            int[] found = search.find(x, y, parents, parents.length, parents.length);
            if (found == null) {
                found = searchNeighbours(x, y);
            }
            fromScore.put(key, found);
            return found;
        }

        private int[] searchNeighbours(int x, int y) {
            int[] fromX = AdjacencySearch.without(skeleton.neighbours(x), y);
            int[] fromY = AdjacencySearch.without(skeleton.neighbours(y), x);
            int top = Math.min(maxDepth, Math.max(fromX.length, fromY.length));
            for (int level = 0; level <= top; level++) {
                int[] sep = search.find(x, y, fromX, fromX.length, level);
                if (sep == null) {
                    sep = search.find(x, y, fromY, fromY.length, level);
                }
                if (sep != null) {
                    return sep;
                }
            }
            return null;
        }
    }
}

package dev.touchstone.learners.score;

import dev.touchstone.core.learner.ParallelLoop;
import dev.touchstone.core.learner.RunContext;
import dev.touchstone.learners.knowledge.KnowledgeIndex;
import org.apache.commons.rng.UniformRandomProvider;

import java.util.ArrayList;
import java.util.Arrays;
import java.util.Comparator;
import java.util.HashMap;
import java.util.HashSet;
import java.util.List;
import java.util.Map;
import java.util.Set;
import java.util.PriorityQueue;
import java.util.function.IntConsumer;
import java.util.stream.IntStream;

/**
 * Greedy equivalence search (Chickering 2002, "Optimal structure identification with
 * greedy search", JMLR 3): a forward phase of Insert operators and a backward phase of
 * Delete operators over equivalence classes, each move followed by re-completion of the
 * PDAG to a CPDAG.
 *
 * <p><b>Operators</b> (ibid., §4, theorems 15 and 17). Insert(X, Y, T) for non-adjacent
 * X, Y and T ⊆ T₀ (undirected neighbours of Y not adjacent to X) is valid when
 * NA_{Y,X} ∪ T is a clique and every semi-directed path from Y to X meets NA_{Y,X} ∪ T;
 * it adds X → Y and directs T — Y as T → Y, changing the score by
 * s(Y, NA ∪ T ∪ Pa(Y) ∪ {X}) − s(Y, NA ∪ T ∪ Pa(Y)). Delete(X, Y, H) for X — Y or X → Y and
 * H ⊆ NA_{Y,X} is valid when NA_{Y,X} \ H is a clique; it removes the edge and directs
 * Y — H as Y → H and X — H as X → H, changing the score by
 * s(Y, (NA \ H) ∪ Pa(Y) \ {X}) − s(Y, (NA \ H) ∪ Pa(Y) ∪ {X}).
 *
 * <p><b>Caching</b> (in the manner of the fast GES literature, e.g. Ramsey et al. 2017,
 * "A million variables and more", which we follow only in idea): the forward phase keeps
 * the best Insert of every ordered pair, rated over the T that satisfy the clique
 * condition, in a priority queue; only improving ratings are stored, per y, so the
 * bookkeeping is sparse in p ({@link Ratings}). After a move only the pairs (X, Y) whose
 * rating can have changed are re-rated: every X for a Y whose own edges changed or that has
 * two or more changed undirected neighbours, and only the changed X for a Y with one changed
 * undirected neighbour. The X adjacent to no undirected neighbour of Y share their candidate
 * sets and the scores without X, which are computed once per Y, and when all X of a Y are
 * re-rated those X are first screened with batched scores, only the ones that may improve
 * being rated exactly ({@link Column}). The
 * semi-directed path condition, which is global, is checked when an operator reaches the
 * top of the queue; an operator that fails it is re-rated with the condition enforced, and
 * its pair is remembered as cut. When the queue has no improving operator left, the cut
 * pairs are re-rated with all conditions enforced (no other pair can hold a valid improving
 * Insert, see {@link Ratings}), so the phase ends exactly when no valid improving Insert
 * exists, as in the paper. The backward phase (few edges) re-rates every adjacent pair after
 * each move. Sweeps are spread over {@link RunContext#threads()} threads; results do not
 * depend on the thread count (the queue is totally ordered by score change, then X, then Y).
 *
 * <p><b>Start</b>: the class of the required edges, or of a given start graph
 * ({@link #run(Pdag)}); the operators apply to any class.
 *
 * <p><b>Background knowledge</b>: required edges are in the start graph and never
 * deleted; an Insert or Delete that would create a forbidden orientation (X → Y, T → Y,
 * Y → H, X → H) is not considered; the completion orients undirected edges as the knowledge
 * demands (Meek 1995). With knowledge the graph is then a maximally oriented PDAG rather
 * than a CPDAG, and the operators are applied to it as they are (common practice).
 *
 * <p><b>Finite samples</b>: the search is exact (its operators and the cached ratings are
 * cross-checked against brute force and a naive search in the tests), but the classical BIC
 * admits a null edge whenever its likelihood-ratio statistic exceeds c·ln n, i.e. with
 * probability P(χ²₁ > c·ln n) ≈ 0.0086 per pair at n = 1,000 and c = 1; over p(p − 1)/2
 * pairs that is about 170 extra edges at p = 200 and 4,300 at p = 1,000, and the estimate
 * then scores higher than the truth. Greedy local optima below the truth's score also occur.
 * See docs/dev/score.md for the evidence and the penalty multiplier's effect.
 *
 * <p><b>Variants</b> ({@link Variants}, all off by default), each of which only accepts moves
 * or results that raise the score, so none can end below the plain search: the phases run again
 * until a whole round makes no move (common practice); a turning phase after the backward one
 * applies the best improving Turn(u, v, C) — reversing an edge of the class, after Hauser and
 * Bühlmann (2012, JMLR 13; see {@link #turnsOf} and {@link #afterTurn}) — while one exists;
 * and seeded perturbed starts re-run the phases from random edge additions and removals of the
 * best class so far. Each turn costs a consistent extension and a completion, and a turning
 * sweep rates every edge in both directions over the cliques of v's undirected neighbours, so
 * the phase is meant for small and medium p (it is what the exact optimum can judge).
 *
 * <p><b>Cost</b>: the first sweep rates p(p − 1) pairs with one local score each (plus one
 * per Y); a forward move re-rates O(c · p) pairs, c the nodes whose edges changed (plus those
 * next to two of them); Insert enumerates the cliques of T₀ (exponential only in dense
 * graphs, bounded by {@code maxParents}); each move copies and re-completes the PDAG, O(p +
 * edges) with the sparse {@link Pdag} (cost of the completion), and finds the changed nodes
 * in O(p + edges). Nothing per move is quadratic in p; over a run the re-rates add up to
 * O(moves · p) local scores, which dominates at large p (docs/dev/score.md has the figures).
 */
final class GesSearch {

    private static final Comparator<Candidate> BEST_FIRST = Comparator
            .comparingDouble((Candidate c) -> -c.delta)
            .thenComparingInt(c -> c.x)
            .thenComparingInt(c -> c.y);

    /** Score changes at or below this count as no improvement (rounding of the local scores). */
    static final double MIN_IMPROVEMENT = 1e-9;

    private final LocalScore score;
    private final KnowledgeIndex knowledge;
    private final Completion completion;
    private final int maxParents;
    private final RunContext context;
    private final int p;
    private Pdag graph;
    private int forwardMoves;
    private int backwardMoves;
    private int turningMoves;
    private int startsImproved;
    private Variants variants = Variants.PLAIN;
    private ParallelLoop pool = ParallelLoop.of(1);

    /**
     * The additions to the plain two-phase search, all off in {@link #PLAIN}:
     * {@code repeatPhases} runs the phases again until a whole round makes no move (common
     * practice); {@code turning} adds a phase of edge turns after the backward phase (Hauser
     * and Bühlmann 2012); {@code perturbedStarts} further searches, each from the best class
     * so far after {@code randomMovesPerStart} random edge additions or removals, keeping the
     * best-scoring class.
     */
    record Variants(boolean repeatPhases, boolean turning, int perturbedStarts, int randomMovesPerStart) {
        static final Variants PLAIN = new Variants(false, false, 0, 0);
    }

    /** Re-completes a PDAG after a move; see {@link CpdagCompletion}. */
    interface Completion {
        Pdag complete(Pdag pdag);

        /** A consistent DAG extension of the PDAG (Dor and Tarsi 1992), or null when it has none. */
        Pdag extend(Pdag pdag);
    }

    GesSearch(LocalScore score, KnowledgeIndex knowledge, Completion completion, int maxParents, RunContext context) {
        this.score = score;
        this.knowledge = knowledge;
        this.completion = completion;
        this.maxParents = maxParents < 0 ? Integer.MAX_VALUE : maxParents;
        this.context = context;
        this.p = score.variableCount();
    }

    /** Sets the additions to the plain search; call before {@link #run}. */
    GesSearch variants(Variants chosen) {
        this.variants = chosen;
        return this;
    }

    /**
     * Runs the phases from the graph of required edges (forward, backward, then turning when
     * asked; again until a round makes no move when asked), then the perturbed starts, and
     * returns the final PDAG.
     */
    Pdag run() {
        Pdag start = new Pdag(p);
        for (int[] e : knowledge.requiredEdges()) {
            start.addDirected(e[0], e[1]);
        }
        return run(start);
    }

    /**
     * As {@link #run()}, from the equivalence class of {@code start} (a DAG or PDAG holding the
     * required edges, such as {@link StartDag} builds): Chickering's operators apply to any
     * class, so both phases simply begin there. From the empty graph this is the plain search.
     */
    Pdag run(Pdag start) {
        graph = completion.complete(start);
        context.checkDeadline();
        withPool(() -> {
            phases();
            if (variants.perturbedStarts() > 0) {
                perturbedStarts();
            }
        });
        return graph;
    }

    /**
     * Runs only the backward phase (Delete operators) from the completion of {@code start}
     * and returns the final PDAG: the backward equivalence search that the permutation
     * searches apply to the graph of their best order ({@link BossSearch}).
     */
    Pdag backwardFrom(Pdag start) {
        graph = completion.complete(start);
        context.checkDeadline();
        withPool(this::backward);
        return graph;
    }

    /**
     * Makes {@code pdag} the current graph, so that the operators can be enumerated on it
     * ({@link #validInserts}, {@link #validDeletes}); for the brute-force cross-check tests.
     */
    void startAt(Pdag pdag) {
        graph = pdag;
    }

    int forwardMoves() {
        return forwardMoves;
    }

    int backwardMoves() {
        return backwardMoves;
    }

    int turningMoves() {
        return turningMoves;
    }

    /** The number of perturbed starts that ended in a better class than the best before them. */
    int startsImproved() {
        return startsImproved;
    }

    /**
     * Forward, backward and (when asked) turning phase; with {@code repeatPhases} again until a
     * whole round makes no move. Every move raises the score by more than
     * {@link #MIN_IMPROVEMENT}, so the rounds end (there are finitely many classes).
     */
    private void phases() {
        while (true) {
            int before = forwardMoves + backwardMoves + turningMoves;
            forward();
            backward();
            if (variants.turning()) {
                turning();
            }
            if (!variants.repeatPhases() || forwardMoves + backwardMoves + turningMoves == before) {
                return;
            }
        }
    }

    // ---------------------------------------------------------------- whole-class score

    /** The score of the class: the sum of local scores of a consistent extension (all members score alike). */
    double classScore(Pdag pdag) {
        Pdag dag = completion.extend(pdag);
        if (dag == null) {
            throw new IllegalStateException("a GES state without a consistent extension");
        }
        double s = 0;
        for (int v = 0; v < p; v++) {
            s += score.localScore(v, dag.parents(v));
        }
        return s;
    }

    private static boolean higher(double candidate, double best) {
        return candidate > best + MIN_IMPROVEMENT * Math.max(1.0, Math.abs(best));
    }

    // ---------------------------------------------------------------- perturbed starts

    /**
     * Seeded restarts: each takes a DAG of the best class so far, makes
     * {@code randomMovesPerStart} random edge additions (acyclic, allowed by knowledge and the
     * parent limit) or removals (of edges knowledge does not require), re-completes it to its
     * class and runs the phases from there; the best class over all is kept. It only ever
     * replaces the result by a better-scoring one, so it cannot end below the plain search.
     */
    private void perturbedStarts() {
        UniformRandomProvider rng = context.random("ges perturbed starts");
        Pdag best = graph;
        double bestScore = classScore(best);
        for (int r = 0; r < variants.perturbedStarts(); r++) {
            context.checkDeadline();
            graph = completion.complete(perturb(best, rng));
            phases();
            double s = classScore(graph);
            if (higher(s, bestScore)) {
                best = graph;
                bestScore = s;
                startsImproved++;
            }
        }
        graph = best;
    }

    private Pdag perturb(Pdag cls, UniformRandomProvider rng) {
        Pdag dag = completion.extend(cls);
        dag.perturb(rng, variants.randomMovesPerStart(), (g, x, y) -> {
            if (g.adjacent(x, y)) {
                if (knowledge.isRequiredEitherWay(x, y)) {
                    return false;
                }
                g.remove(x, y);
                return true;
            }
            if (knowledge.isForbidden(x, y) || g.parents(y).length >= maxParents || g.directedPath(y, x, -1, -1)) {
                return false;
            }
            g.addDirected(x, y);
            return true;
        });
        return dag;
    }

    // ---------------------------------------------------------------- forward phase

    private void forward() {
        Ratings ratings = new Ratings();
        int[] allY = IntStream.range(0, p).toArray();
        ratePairs(allY, null, ratings);
        while (true) {
            context.checkDeadline();
            Candidate best = ratings.queue.poll();
            if (best == null || best.delta <= MIN_IMPROVEMENT) {
                ratings.queue.clear();
                ratings.resweepCutPairs();
                best = ratings.queue.poll();
                if (best == null || best.delta <= MIN_IMPROVEMENT) {
                    return;
                }
            }
            if (!ratings.isCurrent(best)) {
                continue;
            }
            if (!stillValidInsert(best)) {
                Candidate again = bestInsert(best.x, best.y, graph.parents(best.y), graph.undirectedNeighbours(best.y), true);
                ratings.replace(best.x, best.y, again, true);
                continue;
            }
            Pdag before = graph;
            graph = afterInsert(best);
            forwardMoves++;
            rerateAfterMove(before, ratings);
        }
    }

    /**
     * The forward phase's bookkeeping, sparse in p: per y, the queued (improving) rating of each
     * x, and the pairs whose rating was cut by the semi-directed path condition. A queued
     * candidate is acted on only while it is still the current rating of its pair.
     *
     * <p>Why only the cut pairs are swept again when the queue runs dry: every other pair's
     * rating is the best over the clique condition alone and is kept up to date after every
     * move ({@link #rerateAfterMove}); once no such rating improves, no valid Insert of those
     * pairs can improve either (the path condition only removes candidates). A cut pair's
     * rating can be stale, because the path condition is global, so those are re-rated with
     * all conditions. This gives the same operators as re-rating every pair, at the cost of
     * the cut pairs only.
     */
    private final class Ratings {
        final PriorityQueue<Candidate> queue = new PriorityQueue<>(BEST_FIRST);
        @SuppressWarnings("unchecked")
        private final Map<Integer, Candidate>[] queued = new Map[p];
        @SuppressWarnings("unchecked")
        private final Set<Integer>[] cut = new Set[p];
        private int cutCount;

        boolean isCurrent(Candidate c) {
            return queued[c.y] != null && queued[c.y].get(c.x) == c;
        }

        /** Forgets every rating of y. */
        void clear(int y) {
            if (queued[y] != null) {
                queued[y].clear();
            }
            if (cut[y] != null) {
                cutCount -= cut[y].size();
                cut[y].clear();
            }
        }

        /** Makes {@code c} (null or not improving: none) the rating of (x, y); {@code cutByPath} as it was rated. */
        void replace(int x, int y, Candidate c, boolean cutByPath) {
            if (queued[y] != null) {
                queued[y].remove(x);
            }
            if (cut[y] != null && cut[y].remove(x)) {
                cutCount--;
            }
            if (cutByPath) {
                if (cut[y] == null) {
                    cut[y] = new HashSet<>();
                }
                cut[y].add(x);
                cutCount++;
            }
            add(c);
        }

        /** Queues {@code c} as its pair's rating when it improves the score (its pair's old rating already forgotten). */
        void add(Candidate c) {
            if (c != null && c.delta > MIN_IMPROVEMENT) {
                if (queued[c.y] == null) {
                    queued[c.y] = new HashMap<>();
                }
                queued[c.y].put(c.x, c);
                queue.add(c);
            }
        }

        /** Re-rates the pairs cut by the path condition with all conditions, in a fixed order. */
        void resweepCutPairs() {
            if (cutCount == 0) {
                return;
            }
            List<int[]> pairs = new ArrayList<>();
            for (int y = 0; y < p; y++) {
                if (cut[y] != null) {
                    int[] xs = cut[y].stream().mapToInt(Integer::intValue).sorted().toArray();
                    for (int x : xs) {
                        pairs.add(new int[] {x, y});
                    }
                }
            }
            Candidate[] rated = new Candidate[pairs.size()];
            parallel(rated.length, i -> {
                int[] xy = pairs.get(i);
                rated[i] = bestInsert(xy[0], xy[1], graph.parents(xy[1]), graph.undirectedNeighbours(xy[1]), true);
            });
            for (int i = 0; i < rated.length; i++) {
                replace(pairs.get(i)[0], pairs.get(i)[1], rated[i], true);
            }
        }
    }

    /** The completed graph after Insert(x, y, T): x → y added, T — y directed T → y (Chickering 2002, §4). */
    Pdag afterInsert(Candidate insert) {
        Pdag next = new Pdag(graph);
        next.addDirected(insert.x, insert.y);
        for (int t : insert.set) {
            next.orient(t, insert.y);
        }
        return completion.complete(next);
    }

    /**
     * The completed graph after Delete(x, y, H): the edge removed, y — h directed y → h and
     * x — h directed x → h for h in H (Chickering 2002, §4).
     */
    Pdag afterDelete(Candidate delete) {
        Pdag next = new Pdag(graph);
        next.remove(delete.x, delete.y);
        for (int h : delete.set) {
            next.orient(delete.y, h);
            if (next.undirected(delete.x, h)) {
                next.orient(delete.x, h);
            }
        }
        return completion.complete(next);
    }

    /**
     * Rates the Inserts (x, y) for the given y and x in {@code xs} (every x when null) over the
     * clique condition, replacing those pairs' ratings.
     */
    private void ratePairs(int[] ys, int[] xs, Ratings ratings) {
        int count = xs == null ? p : xs.length;
        List<List<Candidate>> rated = new ArrayList<>(ys.length);
        for (int i = 0; i < ys.length; i++) {
            rated.add(null);
        }
        parallel(ys.length, i -> {
            int y = ys[i];
            if ((i & 15) == 0) {
                context.checkDeadline();
            }
            Column column = new Column(y);
            if (xs == null) {
                column.screen();
            }
            List<Candidate> improving = new ArrayList<>();
            for (int j = 0; j < count; j++) {
                int x = xs == null ? j : xs[j];
                if (x != y) {
                    Candidate c = column.bestInsert(x);
                    if (c != null && c.delta > MIN_IMPROVEMENT) {
                        improving.add(c);
                    }
                }
            }
            rated.set(i, improving);
        });
        for (int i = 0; i < ys.length; i++) {
            int y = ys[i];
            if (xs == null) {
                ratings.clear(y);
            } else {
                for (int x : xs) {
                    if (x != y) {
                        ratings.replace(x, y, null, false);
                    }
                }
            }
            for (Candidate c : rated.get(i)) {
                ratings.add(c);
            }
        }
    }

    /**
     * The clique-condition ratings of the Inserts into one y. Every x adjacent to none of y's
     * undirected neighbours has NA_{Y,X} = ∅ and the same T₀, so those x share the candidate
     * sets T and the scores s(Y, Pa(Y) ∪ T) without x: these are enumerated and scored once per
     * y (in the order {@link #enumerateT} uses, so ties resolve alike), and each such x costs one
     * local score per T. Any other x takes the general enumeration.
     */
    private final class Column {
        private final int y;
        private final int[] pa;
        private final int[] ne;
        private final List<int[]> sets = new ArrayList<>();
        private final List<int[]> ts = new ArrayList<>();
        private final double[] without;
        /** Per x, the batched best gain over the shared sets (see {@link #screen}); null when not screened. */
        private double[] bound;
        private double tolerance;

        Column(int y) {
            this.y = y;
            this.pa = graph.parents(y);
            this.ne = graph.undirectedNeighbours(y);
            if (pa.length + 1 <= maxParents) {
                int[] t0 = new int[ne.length];
                int nt0 = 0;
                for (int z : ne) {
                    if (!knowledge.isForbidden(z, y)) {
                        t0[nt0++] = z;
                    }
                }
                int[] base = Arrays.copyOf(pa, pa.length + nt0);
                collect(base, pa.length, t0, nt0, 0, new int[nt0], 0);
            }
            this.without = new double[sets.size()];
            for (int i = 0; i < without.length; i++) {
                without[i] = score.localScore(y, sets.get(i));
            }
        }

        /**
         * Rates every x that takes the shared sets at once with {@link LocalScore#scoreAdditions}
         * (for the BIC one Cholesky factor per set and O(|S|) per x, instead of a factor per x).
         * Those batched scores equal the single ones only up to rounding, so they only screen:
         * an x whose batched best gain is below the improvement threshold by more than a
         * tolerance far above that rounding (10⁻⁶ of the largest score) cannot improve and is
         * dropped; every other x is rated exactly as before. Ratings that are kept are therefore
         * the same numbers as without screening, and no improving one is dropped.
         */
        void screen() {
            if (without.length == 0) {
                return;
            }
            boolean[] shared = new boolean[p];
            int count = 0;
            for (int x = 0; x < p; x++) {
                shared[x] = x != y && !graph.adjacent(x, y) && !knowledge.isForbidden(x, y) && !adjacentToNeighbour(x);
                count += shared[x] ? 1 : 0;
            }
            if (count == 0) {
                return;
            }
            double[] best = new double[p];
            Arrays.fill(best, Double.NEGATIVE_INFINITY);
            double[] out = new double[p];
            double largest = 1.0;
            for (int i = 0; i < without.length; i++) {
                score.scoreAdditions(y, sets.get(i), shared, out);
                largest = Math.max(largest, Math.abs(without[i]));
                for (int x = 0; x < p; x++) {
                    if (shared[x]) {
                        largest = Math.max(largest, Math.abs(out[x]));
                        best[x] = Math.max(best[x], out[x] - without[i]);
                    }
                }
            }
            bound = best;
            tolerance = 1e-6 * largest;
        }

        private boolean adjacentToNeighbour(int x) {
            for (int z : ne) {
                if (graph.adjacent(z, x)) {
                    return true;
                }
            }
            return false;
        }

        private void collect(int[] base, int fixed, int[] t0, int nt0, int from, int[] chosen, int nChosen) {
            int size = fixed + nChosen;
            sets.add(Arrays.copyOf(base, size));
            ts.add(Arrays.copyOf(chosen, nChosen));
            if (size + 2 > maxParents) {
                return;
            }
            for (int i = from; i < nt0; i++) {
                int t = t0[i];
                boolean clique = true;
                for (int k = 0; k < nChosen && clique; k++) {
                    clique = graph.adjacent(t, chosen[k]);
                }
                if (!clique) {
                    continue;
                }
                chosen[nChosen] = t;
                base[size] = t;
                collect(base, fixed, t0, nt0, i + 1, chosen, nChosen + 1);
            }
        }

        /**
         * The best Insert(x, y, T) over the clique condition, as
         * {@link GesSearch#bestInsert(int, int, int[], int[], boolean)}, or null when it does not improve the score.
         */
        Candidate bestInsert(int x) {
            if (graph.adjacent(x, y) || knowledge.isForbidden(x, y)) {
                return null;
            }
            if (adjacentToNeighbour(x)) {
                return GesSearch.this.bestInsert(x, y, pa, ne, false);
            }
            if (bound != null && !(bound[x] > MIN_IMPROVEMENT - tolerance)) {
                return null;
            }
            int best = -1;
            double bestDelta = 0;
            for (int i = 0; i < without.length; i++) {
                int[] set = sets.get(i);
                int[] with = Arrays.copyOf(set, set.length + 1);
                with[set.length] = x;
                double delta = score.localScore(y, with) - without[i];
                if (best < 0 || delta > bestDelta) {
                    best = i;
                    bestDelta = delta;
                }
            }
            // only improving ratings are kept, so the p(p − 1) others of the first sweep allocate nothing
            return best < 0 || bestDelta <= MIN_IMPROVEMENT ? null : new Candidate(bestDelta, x, y, ts.get(best));
        }
    }

    /**
     * Re-rates the pairs whose rating a move can have changed. The rating of (x, y) depends on
     * Pa(y), Ne(y) (undirected neighbours), the adjacencies of x with Ne(y) and those within
     * Ne(y). So: every x for a y whose own edges changed, or with two or more changed
     * neighbours; only the changed x for a y with exactly one changed undirected neighbour
     * (an adjacency between x and that neighbour changes only when both are changed nodes).
     * Finding the changed nodes costs O(p + edges); the pairs re-rated are O(c · p), c the
     * nodes whose edges changed (plus those next to two of them).
     */
    private void rerateAfterMove(Pdag before, Ratings ratings) {
        boolean[] changed = new boolean[p];
        int nChanged = 0;
        for (int v = 0; v < p; v++) {
            if (!graph.sameNeighbourhood(before, v)) {
                changed[v] = true;
                nChanged++;
            }
        }
        int[] changedNodes = new int[nChanged];
        int[] full = new int[p];
        int[] partial = new int[p];
        int nFull = 0;
        int nPartial = 0;
        int k = 0;
        for (int v = 0; v < p; v++) {
            if (changed[v]) {
                changedNodes[k++] = v;
                full[nFull++] = v;
                continue;
            }
            int changedNeighbours = 0;
            for (int m = 0; m < graph.degree(v); m++) {
                if (changed[graph.neighbour(v, m)] && graph.neighbourState(v, m) == Pdag.UNDIRECTED) {
                    changedNeighbours++;
                }
            }
            if (changedNeighbours >= 2) {
                full[nFull++] = v;
            } else if (changedNeighbours == 1) {
                partial[nPartial++] = v;
            }
        }
        ratePairs(Arrays.copyOf(full, nFull), null, ratings);
        if (nPartial > 0) {
            ratePairs(Arrays.copyOf(partial, nPartial), changedNodes, ratings);
        }
    }

    /**
     * The best Insert(x, y, T) over the T satisfying the clique condition (and, when
     * {@code checkPath}, the semi-directed path condition), or null when there is none.
     */
    Candidate bestInsert(int x, int y, int[] pa, int[] ne, boolean checkPath) {
        Candidate[] best = new Candidate[1];
        if (!checkPath) {
            enumerateInserts(x, y, pa, ne, null, best);
            return best[0];
        }
        List<Candidate> all = insertsPassingClique(x, y, pa, ne);
        if (all.isEmpty()) {
            return null;
        }
        int[] na = neighboursAdjacentTo(y, x, -1);
        all.sort(Comparator.comparingDouble((Candidate c) -> -c.delta));
        for (Candidate c : all) {
            if (c.delta <= MIN_IMPROVEMENT) {
                return null;
            }
            if (!semiDirectedPathAvoiding(y, x, union(na, na.length, c.set))) {
                return c;
            }
        }
        return null;
    }

    /**
     * Rates every Insert(x, y, T) with NA_{Y,X} ∪ T a clique (T ⊆ T₀, within {@code maxParents}),
     * adding each to {@code all} when it is not null and keeping the best in {@code best[0]}.
     */
    private void enumerateInserts(int x, int y, int[] pa, int[] ne, List<Candidate> all, Candidate[] best) {
        if (graph.adjacent(x, y) || knowledge.isForbidden(x, y)) {
            return;
        }
        int[] na = new int[ne.length];
        int[] t0 = new int[ne.length];
        int nna = 0;
        int nt0 = 0;
        for (int z : ne) {
            if (graph.adjacent(z, x)) {
                na[nna++] = z;
            } else if (!knowledge.isForbidden(z, y)) {
                t0[nt0++] = z;
            }
        }
        if (!graph.isClique(na, nna)) {
            return;
        }
        int fixed = pa.length + nna;
        if (fixed + 1 > maxParents) {
            return;
        }
        // parents without x: pa ∪ na ∪ T, then x appended
        int[] base = new int[fixed + nt0 + 1];
        System.arraycopy(pa, 0, base, 0, pa.length);
        System.arraycopy(na, 0, base, pa.length, nna);
        enumerateT(x, y, base, fixed, t0, nt0, 0, new int[nt0], 0, na, nna, all, best);
    }

    /** The undirected neighbours of y (other than {@code except}) adjacent to x: NA_{Y,X}. */
    private int[] neighboursAdjacentTo(int y, int x, int except) {
        int[] ne = graph.undirectedNeighbours(y);
        int[] na = new int[ne.length];
        int n = 0;
        for (int z : ne) {
            if (z != except && graph.adjacent(z, x)) {
                na[n++] = z;
            }
        }
        return Arrays.copyOf(na, n);
    }

    /**
     * Every valid Insert(x, y, T) on the current graph (theorem 15 of Chickering 2002: the
     * clique and the semi-directed path conditions) with its score change, improving or not.
     */
    List<Candidate> validInserts(int x, int y) {
        List<Candidate> out = new ArrayList<>();
        for (Candidate c : insertsPassingClique(x, y, graph.parents(y), graph.undirectedNeighbours(y))) {
            int[] na = neighboursAdjacentTo(y, x, -1);
            if (!semiDirectedPathAvoiding(y, x, union(na, na.length, c.set))) {
                out.add(c);
            }
        }
        return out;
    }

    /** Every Insert(x, y, T) with NA ∪ T a clique, rated; empty when x, y are adjacent or x → y forbidden. */
    private List<Candidate> insertsPassingClique(int x, int y, int[] pa, int[] ne) {
        List<Candidate> all = new ArrayList<>();
        enumerateInserts(x, y, pa, ne, all, new Candidate[1]);
        return all;
    }

    private void enumerateT(int x, int y, int[] base, int fixed, int[] t0, int nt0, int from, int[] chosen,
                            int nChosen, int[] na, int nna, List<Candidate> all, Candidate[] best) {
        int size = fixed + nChosen;
        int[] without = Arrays.copyOf(base, size);
        int[] with = Arrays.copyOf(base, size + 1);
        with[size] = x;
        double delta = score.localScore(y, with) - score.localScore(y, without);
        Candidate c = new Candidate(delta, x, y, Arrays.copyOf(chosen, nChosen));
        if (all != null) {
            all.add(c);
        }
        if (best[0] == null || delta > best[0].delta) {
            best[0] = c;
        }
        if (size + 2 > maxParents) {
            return;
        }
        for (int i = from; i < nt0; i++) {
            int t = t0[i];
            boolean clique = true;
            for (int k = 0; k < nna && clique; k++) {
                clique = graph.adjacent(t, na[k]);
            }
            for (int k = 0; k < nChosen && clique; k++) {
                clique = graph.adjacent(t, chosen[k]);
            }
            if (!clique) {
                continue;
            }
            chosen[nChosen] = t;
            base[size] = t;
            enumerateT(x, y, base, fixed, t0, nt0, i + 1, chosen, nChosen + 1, na, nna, all, best);
        }
    }

    private boolean stillValidInsert(Candidate c) {
        int x = c.x;
        int y = c.y;
        if (graph.adjacent(x, y)) {
            return false;
        }
        int[] ne = graph.undirectedNeighbours(y);
        int[] na = new int[ne.length];
        int nna = 0;
        for (int z : ne) {
            if (graph.adjacent(z, x)) {
                na[nna++] = z;
            }
        }
        for (int t : c.set) {
            if (!graph.undirected(t, y) || graph.adjacent(t, x)) {
                return false;
            }
        }
        int[] clique = union(na, nna, c.set);
        if (!graph.isClique(clique, clique.length)) {
            return false;
        }
        int[] pa = graph.parents(y);
        int[] without = new int[pa.length + clique.length];
        System.arraycopy(pa, 0, without, 0, pa.length);
        System.arraycopy(clique, 0, without, pa.length, clique.length);
        int[] with = Arrays.copyOf(without, without.length + 1);
        with[without.length] = x;
        double delta = score.localScore(y, with) - score.localScore(y, without);
        if (Math.abs(delta - c.delta) > 1e-9 * Math.max(1.0, Math.abs(delta))) {
            return false;
        }
        return !semiDirectedPathAvoiding(y, x, clique);
    }

    /** Whether a path from {@code from} to {@code to} along edges u → w or u — w avoids all of {@code blocked}. */
    private boolean semiDirectedPathAvoiding(int from, int to, int[] blocked) {
        boolean[] seen = new boolean[p];
        for (int b : blocked) {
            seen[b] = true;
        }
        int[] stack = new int[p];
        int top = 0;
        stack[top++] = from;
        seen[from] = true;
        while (top > 0) {
            int u = stack[--top];
            for (int k = 0; k < graph.degree(u); k++) {
                int w = graph.neighbour(u, k);
                byte s = graph.neighbourState(u, k);
                if (seen[w] || (s != Pdag.OUT && s != Pdag.UNDIRECTED)) {
                    continue;
                }
                if (w == to) {
                    return true;
                }
                seen[w] = true;
                stack[top++] = w;
            }
        }
        return false;
    }

    // ---------------------------------------------------------------- backward phase

    private void backward() {
        while (true) {
            context.checkDeadline();
            int[] edges = adjacentOrderedPairs();
            Candidate[] rated = new Candidate[edges.length];
            parallel(edges.length, i -> {
                if ((i & 63) == 0) {
                    context.checkDeadline();
                }
                rated[i] = bestDelete(edges[i] / p, edges[i] % p);
            });
            Candidate best = null;
            for (Candidate c : rated) {
                if (c != null && c.delta > MIN_IMPROVEMENT && (best == null || BEST_FIRST.compare(c, best) < 0)) {
                    best = c;
                }
            }
            if (best == null) {
                return;
            }
            graph = afterDelete(best);
            backwardMoves++;
        }
    }

    /** Pairs x·p + y with x → y or x — y (undirected edges give both orders). */
    private int[] adjacentOrderedPairs() {
        int[] out = new int[2 * graph.edgeCount()];
        int n = 0;
        for (int y = 0; y < p; y++) {
            for (int k = 0; k < graph.degree(y); k++) {
                int x = graph.neighbour(y, k);
                byte s = graph.neighbourState(y, k);
                if (s == Pdag.IN || s == Pdag.UNDIRECTED) {
                    out[n++] = x * p + y;
                }
            }
        }
        int[] pairs = Arrays.copyOf(out, n);
        Arrays.sort(pairs);
        return pairs;
    }

    /** The best Delete(x, y, H) over the H with NA \ H a clique and no forbidden orientation, or null. */
    Candidate bestDelete(int x, int y) {
        Candidate[] best = new Candidate[1];
        enumerateDeletes(x, y, null, best);
        return best[0];
    }

    /**
     * Every valid Delete(x, y, H) on the current graph (theorem 17 of Chickering 2002: NA_{Y,X} \ H
     * a clique) with its score change, improving or not; x → y or x — y must be an edge.
     */
    List<Candidate> validDeletes(int x, int y) {
        List<Candidate> all = new ArrayList<>();
        enumerateDeletes(x, y, all, new Candidate[1]);
        return all;
    }

    private void enumerateDeletes(int x, int y, List<Candidate> all, Candidate[] best) {
        if (knowledge.isRequiredEitherWay(x, y)) {
            return;
        }
        int[] pa = graph.parents(y);
        int[] na = neighboursAdjacentTo(y, x, x);
        int nna = na.length;
        // the parents of y other than x; the kept clique C = NA \ H is added to them
        int[] base = new int[pa.length + nna + 1];
        int nb = 0;
        for (int v : pa) {
            if (v != x) {
                base[nb++] = v;
            }
        }
        enumerateKept(x, y, base, nb, na, nna, 0, new int[nna], 0, all, best);
    }

    private void enumerateKept(int x, int y, int[] base, int nb, int[] na, int nna, int from, int[] kept, int nKept,
                               List<Candidate> all, Candidate[] best) {
        int[] h = removedFrom(na, nna, kept, nKept);
        if (deleteOrientationsAllowed(x, y, h)) {
            int[] without = Arrays.copyOf(base, nb + nKept);
            int[] with = Arrays.copyOf(without, without.length + 1);
            with[without.length] = x;
            double delta = score.localScore(y, without) - score.localScore(y, with);
            Candidate c = new Candidate(delta, x, y, h);
            if (all != null) {
                all.add(c);
            }
            if (best[0] == null || delta > best[0].delta) {
                best[0] = c;
            }
        }
        for (int i = from; i < nna; i++) {
            int c = na[i];
            boolean clique = true;
            for (int k = 0; k < nKept && clique; k++) {
                clique = graph.adjacent(c, kept[k]);
            }
            if (!clique) {
                continue;
            }
            kept[nKept] = c;
            base[nb + nKept] = c;
            enumerateKept(x, y, base, nb, na, nna, i + 1, kept, nKept + 1, all, best);
        }
    }

    private boolean deleteOrientationsAllowed(int x, int y, int[] h) {
        for (int v : h) {
            if (knowledge.isForbidden(y, v) || (graph.undirected(x, v) && knowledge.isForbidden(x, v))) {
                return false;
            }
        }
        return true;
    }

    private static int[] removedFrom(int[] na, int nna, int[] kept, int nKept) {
        int[] out = new int[nna - nKept];
        int n = 0;
        for (int i = 0; i < nna; i++) {
            boolean in = false;
            for (int k = 0; k < nKept && !in; k++) {
                in = kept[k] == na[i];
            }
            if (!in) {
                out[n++] = na[i];
            }
        }
        return out;
    }

    private static int[] union(int[] a, int na, int[] b) {
        int[] out = Arrays.copyOf(a, na + b.length);
        System.arraycopy(b, 0, out, na, b.length);
        return out;
    }

    // ---------------------------------------------------------------- turning phase

    /**
     * The turning phase: while some valid turn improves the score, apply the best one. Turns
     * are rated by their score change (exact: see {@link #turnsOf}), tried best first, and a
     * turn is taken only when the class it reaches scores higher than the current one by the
     * whole-class score, which also keeps the phase sound with background knowledge (whose
     * orientations the completion adds after the move).
     */
    private void turning() {
        Double current = null; // the class score of graph, computed when first needed and kept after each turn
        while (true) {
            context.checkDeadline();
            List<Candidate> improving = new ArrayList<>();
            for (int v = 0; v < p; v++) {
                if ((v & 15) == 15) {
                    context.checkDeadline();
                }
                for (int k = 0; k < graph.degree(v); k++) {
                    int u = graph.neighbour(v, k);
                    if (graph.directed(v, u) || graph.undirected(u, v)) {
                        for (Candidate c : turnsOf(u, v)) {
                            if (c.delta > MIN_IMPROVEMENT) {
                                improving.add(c);
                            }
                        }
                    }
                }
            }
            improving.sort(BEST_FIRST.thenComparing(c -> Arrays.toString(c.set)));
            if (!improving.isEmpty() && current == null) {
                current = classScore(graph);
            }
            boolean moved = false;
            for (Candidate c : improving) {
                context.checkDeadline();
                Pdag next = afterTurn(c);
                double reached = next == null ? Double.NEGATIVE_INFINITY : classScore(next);
                if (next != null && higher(reached, current)) {
                    graph = next;
                    current = reached;
                    turningMoves++;
                    moved = true;
                    break;
                }
            }
            if (!moved) {
                return;
            }
        }
    }

    /**
     * Every turn of the edge between u and v (now v → u or u — v) into u → v, rated, valid or
     * not: Turn(u, v, C) for C a clique of v's undirected neighbours other than u, as Hauser
     * and Bühlmann (2012, JMLR 13, the turning operator of their greedy interventional equivalence search; definition from memory) define it: pick a DAG D of the
     * class with v → u whose parents of v among its undirected neighbours are exactly C, and
     * reverse v → u. Under a decomposable score the change is local to u and v: with
     * Pa_D(v) = Pa(v) ∪ C and Pa_D(u) = Pa(u) ∪ {v} ∪ (C ∩ Ne(u)) (each c in C with c — u
     * must point into u, or c → v → u → c would be a cycle),
     * s(v, Pa_D(v) ∪ {u}) − s(v, Pa_D(v)) + s(u, Pa_D(u) \ {v}) − s(u, Pa_D(u)). All members
     * D with that C give the same change and the same class after the turn (the class of the
     * result is fixed by its skeleton and v-structures, which C determines), so one member
     * suffices; whether one exists whose reversal is acyclic is decided by {@link #afterTurn}.
     */
    List<Candidate> turnsOf(int u, int v) {
        List<Candidate> out = new ArrayList<>();
        if (knowledge.isForbidden(u, v) || knowledge.isRequired(v, u)) {
            return out;
        }
        int[] paV = graph.parents(v);
        if (paV.length + 1 > maxParents) {
            return out;
        }
        int[] ne = graph.undirectedNeighbours(v);
        int[] options = new int[ne.length];
        int n = 0;
        for (int c : ne) {
            if (c != u && !knowledge.isForbidden(c, v)) {
                options[n++] = c;
            }
        }
        enumerateTurns(u, v, paV, Arrays.copyOf(options, n), 0, new int[n], 0, out);
        return out;
    }

    private void enumerateTurns(int u, int v, int[] paV, int[] options, int from, int[] chosen, int nChosen,
                                List<Candidate> out) {
        int[] c = Arrays.copyOf(chosen, nChosen);
        int[] vWithout = union(paV, paV.length, c);
        int[] vWith = Arrays.copyOf(vWithout, vWithout.length + 1);
        vWith[vWithout.length] = u;
        int[] paU = graph.parents(u);
        int[] uWith = Arrays.copyOf(paU, paU.length + 1 + nChosen);
        int nu = paU.length;
        if (!graph.directed(v, u)) {
            uWith[nu++] = v;
        }
        for (int w : c) {
            if (graph.undirected(w, u)) {
                uWith[nu++] = w;
            }
        }
        uWith = Arrays.copyOf(uWith, nu);
        int[] uWithout = new int[nu - 1];
        int m = 0;
        for (int w : uWith) {
            if (w != v) {
                uWithout[m++] = w;
            }
        }
        double delta = score.localScore(v, vWith) - score.localScore(v, vWithout)
                + score.localScore(u, uWithout) - score.localScore(u, uWith);
        out.add(new Candidate(delta, u, v, c));
        if (vWith.length + 1 > maxParents) {
            return;
        }
        for (int i = from; i < options.length; i++) {
            int t = options[i];
            boolean clique = true;
            for (int k = 0; k < nChosen && clique; k++) {
                clique = graph.adjacent(t, chosen[k]);
            }
            if (!clique) {
                continue;
            }
            chosen[nChosen] = t;
            enumerateTurns(u, v, paV, options, i + 1, chosen, nChosen + 1, out);
        }
    }

    /**
     * The class after Turn(u, v, C), or null when the turn is not valid. The member D is built
     * by orienting v → u, C → v, v → w for v's other undirected neighbours, c → u for c in C
     * with c — u and u → w for u's other undirected neighbours (so that as few edges as
     * possible enter u, which leaves the fewest directed paths from v to u), then taking a
     * consistent extension (Dor and Tarsi 1992). The turn is valid when that extension exists
     * and has no directed path from v to u besides the edge, so that reversing it stays
     * acyclic. Which D to pick is our own construction; the brute-force test compares it with
     * every member of the class.
     */
    Pdag afterTurn(Candidate turn) {
        int u = turn.x;
        int v = turn.y;
        Pdag h = new Pdag(graph);
        if (h.undirected(u, v)) {
            h.orient(v, u);
        }
        for (int w : graph.undirectedNeighbours(v)) {
            if (w != u) {
                if (contains(turn.set, w)) {
                    h.orient(w, v);
                } else {
                    h.orient(v, w);
                }
            }
        }
        for (int w : graph.undirectedNeighbours(u)) {
            if (w != v && h.undirected(u, w)) {
                if (contains(turn.set, w)) {
                    h.orient(w, u);
                } else {
                    h.orient(u, w);
                }
            }
        }
        Pdag d = completion.extend(h);
        if (d == null) {
            return null;
        }
        d.remove(v, u);
        if (d.directedPath(v, u, -1, -1)) {
            return null;
        }
        d.addDirected(u, v);
        return completion.complete(d);
    }

    private static boolean contains(int[] a, int x) {
        for (int v : a) {
            if (v == x) {
                return true;
            }
        }
        return false;
    }

    // ---------------------------------------------------------------- threads

    /** Runs {@code search} with this run's threads, releasing them afterwards. */
    private void withPool(Runnable search) {
        pool = ParallelLoop.of(context);
        try {
            search.run();
        } finally {
            pool.close();
        }
    }

    private void parallel(int count, IntConsumer body) {
        pool.run(count, ParallelLoop.CHUNK, body);
    }


    /** A rated operator: Insert(x, y, T) in the forward phase, Delete(x, y, H) in the backward one. */
    static final class Candidate {
        final double delta;
        final int x;
        final int y;
        final int[] set;

        Candidate(double delta, int x, int y, int[] set) {
            this.delta = delta;
            this.x = x;
            this.y = y;
            this.set = set;
        }
    }
}

package dev.touchstone.learners.constraint;

import dev.touchstone.core.graph.Graph;
import dev.touchstone.core.graph.Mark;
import dev.touchstone.core.graph.MutableGraph;
import dev.touchstone.core.learner.RunContext;
import dev.touchstone.learners.independence.IndependenceTest;
import dev.touchstone.learners.knowledge.KnowledgeIndex;

import java.util.ArrayList;
import java.util.HashMap;
import java.util.HashSet;
import java.util.List;
import java.util.Map;
import java.util.Set;

/**
 * PC's second phase: turns a skeleton into a pattern by orienting the edges the background
 * knowledge fixes and then the unshielded colliders x → z ← y, decided by a
 * {@link ColliderRule} and with conflicts resolved by a {@link ConflictRule}.
 *
 * <p>Knowledge first: a required edge takes its direction; an edge with one direction
 * forbidden (explicitly or by tiers) takes the other. A collider never puts an arrowhead
 * that the knowledge forbids and never reverses an edge the knowledge directed.
 *
 * <p>Cost: O(Σ_z deg(z)²) to list the unshielded triples; the conservative and majority
 * rules add, per non-adjacent pair with a common neighbour, one test for every subset (up
 * to the depth limit) of the two neighbourhoods.
 */
final class ColliderOrientation {

    /** Counts reported in the estimate's extras. */
    record Counts(int colliders, int ambiguous, int conflicts) { }

    private final Skeleton skeleton;
    private final IndependenceTest test;
    private final KnowledgeIndex knowledge;
    private final ColliderRule rule;
    private final ConflictRule conflicts;
    private final int maxDepth;
    private final RunContext context;
    private Counts counts = new Counts(0, 0, 0);

    ColliderOrientation(Skeleton skeleton, IndependenceTest test, KnowledgeIndex knowledge, ColliderRule rule,
                        ConflictRule conflicts, int maxDepth, RunContext context) {
        this.skeleton = skeleton;
        this.test = test;
        this.knowledge = knowledge;
        this.rule = rule;
        this.conflicts = conflicts;
        this.maxDepth = maxDepth < 0 ? Integer.MAX_VALUE : maxDepth;
        this.context = context;
    }

    Counts counts() {
        return counts;
    }

    /** The pattern over {@code names}: skeleton edges, knowledge orientations, colliders. */
    MutableGraph orient(List<String> names) {
        int p = skeleton.size();
        MutableGraph g = Graph.builder(names);
        for (int a = 0; a < p; a++) {
            for (int b : skeleton.neighbours(a)) {
                if (b > a) {
                    g.addUndirected(a, b);
                }
            }
        }
        applyKnowledge(g, knowledge);
        List<int[]> colliders = new ArrayList<>();
        int ambiguous = 0;
        Map<Long, List<int[]>> separating = new HashMap<>();
        for (int z = 0; z < p; z++) {
            int[] nb = skeleton.neighbours(z);
            for (int i = 0; i < nb.length; i++) {
                for (int j = i + 1; j < nb.length; j++) {
                    int x = nb[i];
                    int y = nb[j];
                    if (skeleton.adjacent(x, y)) {
                        continue;
                    }
                    context.checkDeadline();
                    Boolean collider = decide(x, z, y, separating);
                    if (collider == null) {
                        ambiguous++;
                    } else if (collider) {
                        colliders.add(new int[] {x, z, y});
                    }
                }
            }
        }
        int conflictCount = conflicts == ConflictRule.KEEP_FIRST ? keepFirst(g, colliders) : dropBoth(g, colliders);
        counts = new Counts(colliders.size(), ambiguous, conflictCount);
        return g;
    }

    /** Orients the edges the knowledge fixes: required directions, and the other side of forbidden ones. */
    static void applyKnowledge(MutableGraph g, KnowledgeIndex knowledge) {
        if (knowledge.isEmpty()) {
            return;
        }
        int p = g.size();
        for (int a = 0; a < p; a++) {
            for (int b : g.neighbours(a)) {
                if (a > b) {
                    continue;
                }
                if (knowledge.isRequired(a, b)) {
                    g.orient(a, b);
                } else if (knowledge.isRequired(b, a)) {
                    g.orient(b, a);
                } else if (knowledge.isForbidden(a, b) && !knowledge.isForbidden(b, a)) {
                    g.orient(b, a);
                } else if (knowledge.isForbidden(b, a) && !knowledge.isForbidden(a, b)) {
                    g.orient(a, b);
                }
            }
        }
    }

    /** TRUE for a collider, FALSE for a non-collider, null when ambiguous. */
    private Boolean decide(int x, int z, int y, Map<Long, List<int[]>> separating) {
        if (rule == ColliderRule.SEPSET) {
            int[] s = skeleton.sepset(x, y);
            if (s == null) {
                // Removed by knowledge without a test: nothing says it is a collider.
                return Boolean.FALSE;
            }
            return !skeleton.sepsetContains(x, y, z);
        }
        long key = (long) Math.min(x, y) * skeleton.size() + Math.max(x, y);
        List<int[]> sets = separating.get(key);
        if (sets == null) {
            sets = allSeparatingSets(Math.min(x, y), Math.max(x, y));
            separating.put(key, sets);
        }
        if (sets.isEmpty()) {
            return null;
        }
        int with = 0;
        for (int[] s : sets) {
            for (int v : s) {
                if (v == z) {
                    with++;
                    break;
                }
            }
        }
        if (rule == ColliderRule.CONSERVATIVE) {
            return with == 0 ? Boolean.TRUE : with == sets.size() ? Boolean.FALSE : null;
        }
        int twice = 2 * with;
        return twice < sets.size() ? Boolean.TRUE : twice > sets.size() ? Boolean.FALSE : null;
    }

    /** Every distinct subset of adj(x)\{y} and of adj(y)\{x} (sizes up to the depth limit) that separates x and y. */
    private List<int[]> allSeparatingSets(int x, int y) {
        SubsetSearch enumerate = new SubsetSearch(test);
        List<int[]> out = new ArrayList<>();
        long[] tests = new long[1];
        for (int side = 0; side < 2; side++) {
            int a = side == 0 ? x : y;
            int b = side == 0 ? y : x;
            int[] cand = AdjacencySearch.without(skeleton.neighbours(a), b);
            int top = Math.min(maxDepth, cand.length);
            boolean second = side == 1;
            for (int size = 0; size <= top; size++) {
                enumerate.forEach(cand, cand.length, size, z -> {
                    // x's side tried every subset of adj(x)\{y} up to the depth limit, so a set of y's side
                    // lying inside adj(x) was tried already: skip it (no boxed set of seen sets needed).
                    if (second && insideNeighbours(z, x)) {
                        return true;
                    }
                    if ((tests[0] & 63) == 0) {
                        context.checkDeadline();
                    }
                    tests[0]++;
                    if (test.independent(x, y, z)) {
                        out.add(z.clone());
                    }
                    return true;
                });
            }
        }
        context.countTests(tests[0]);
        return out;
    }

    /** Whether every member of z is adjacent to v. */
    private boolean insideNeighbours(int[] z, int v) {
        for (int w : z) {
            if (!skeleton.adjacent(v, w)) {
                return false;
            }
        }
        return true;
    }

    private int keepFirst(MutableGraph g, List<int[]> colliders) {
        int skipped = 0;
        for (int[] c : colliders) {
            int x = c[0];
            int z = c[1];
            int y = c[2];
            if (canPointInto(g, x, z) && canPointInto(g, y, z)) {
                g.orient(x, z);
                g.orient(y, z);
            } else {
                skipped++;
            }
        }
        return skipped;
    }

    private boolean canPointInto(MutableGraph g, int u, int z) {
        return g.markAt(u, z) != Mark.ARROW && !knowledge.isForbidden(u, z);
    }

    private int dropBoth(MutableGraph g, List<int[]> colliders) {
        Set<Long> wanted = new HashSet<>();
        int p = g.size();
        for (int[] c : colliders) {
            wanted.add((long) c[0] * p + c[1]);
            wanted.add((long) c[2] * p + c[1]);
        }
        Set<Long> conflicted = new HashSet<>();
        for (long w : wanted) {
            int from = (int) (w / p);
            int to = (int) (w % p);
            if (wanted.contains((long) to * p + from)) {
                conflicted.add(w);
            }
        }
        for (long w : wanted) {
            int from = (int) (w / p);
            int to = (int) (w % p);
            if (!conflicted.contains(w) && canPointInto(g, from, to)) {
                g.orient(from, to);
            }
        }
        return conflicted.size() / 2;
    }
}

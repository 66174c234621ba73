package dev.touchstone.learners.score;

import dev.touchstone.core.learner.RunContext;
import dev.touchstone.learners.knowledge.KnowledgeIndex;

import org.apache.commons.rng.UniformRandomProvider;

import java.util.ArrayDeque;
import java.util.Arrays;
import java.util.HashSet;
import java.util.Set;

/**
 * Hill climbing in the space of DAGs with single-edge additions, removals and reversals, a
 * tabu list and seeded random restarts (common practice; e.g. Heckerman, Geiger and
 * Chickering 1995, §6, for the moves and the decomposable update; Glover 1989 for tabu
 * search).
 *
 * <p>Each step applies the best legal move that is not tabu — even when it lowers the
 * score, so the search can walk off a local maximum — and puts its inverse on the tabu list
 * for {@code tabuLength} steps; a tabu move is still taken when it would beat the best
 * score seen (aspiration). A climb ends after {@code patience} steps without a new best.
 * Each restart perturbs the best DAG by {@code perturbation} random legal moves drawn from
 * the run's seed and climbs again; the best DAG of all climbs is returned.
 *
 * <p><b>Cost</b>: each step rescans the p(p − 1) stored move ratings (O(p²)) and checks
 * acyclicity of the chosen move (O(p + E)); after a move only the ratings of the child
 * whose parents changed are recomputed (O(p) local scores, mostly cache hits).
 */
final class HillClimbSearch {

    static final double MIN_IMPROVEMENT = 1e-9;

    private static final int ADD = 0;
    private static final int REMOVE = 1;
    private static final int REVERSE = 2;

    private final LocalScore score;
    private final KnowledgeIndex knowledge;
    private final int maxParents;
    private final int tabuLength;
    private final int patience;
    private final int restarts;
    private final int perturbation;
    private final RunContext context;
    private final int p;
    private int steps;

    HillClimbSearch(LocalScore score, KnowledgeIndex knowledge, int maxParents, int tabuLength, int patience,
                    int restarts, int perturbation, RunContext context) {
        this.score = score;
        this.knowledge = knowledge;
        this.maxParents = maxParents < 0 ? Integer.MAX_VALUE : maxParents;
        this.tabuLength = tabuLength;
        this.patience = patience;
        this.restarts = restarts;
        this.perturbation = perturbation;
        this.context = context;
        this.p = score.variableCount();
    }

    int steps() {
        return steps;
    }

    /** The best DAG found over all climbs, the first climb starting from {@code start} (a DAG holding the required edges). */
    Pdag run(Pdag start) {
        Climb best = climb(start);
        UniformRandomProvider rng = context.random("hill-climbing restarts");
        for (int r = 0; r < restarts; r++) {
            context.checkDeadline();
            Pdag perturbed = perturb(best.dag, rng);
            Climb c = climb(perturbed);
            if (c.score > best.score + MIN_IMPROVEMENT) {
                best = c;
            }
        }
        return best.dag;
    }

    private record Climb(Pdag dag, double score) {
    }

    private Climb climb(Pdag start) {
        Pdag dag = new Pdag(start);
        double[] local = new double[p];
        double total = 0;
        for (int v = 0; v < p; v++) {
            local[v] = score.localScore(v, dag.parents(v));
            total += local[v];
        }
        // toggle[x·p + y]: change of y's local score if x is added to / removed from Pa(y)
        double[] toggle = new double[p * p];
        for (int y = 0; y < p; y++) {
            context.checkDeadline();
            rateColumn(dag, y, local, toggle);
        }
        Pdag bestDag = new Pdag(dag);
        double bestScore = total;
        int sinceBest = 0;
        ArrayDeque<Long> tabuOrder = new ArrayDeque<>();
        Set<Long> tabu = new HashSet<>();
        while (true) {
            context.checkDeadline();
            long move = bestMove(dag, toggle, tabu, total, bestScore);
            if (move < 0) {
                break;
            }
            int kind = (int) (move >>> 60);
            int x = (int) ((move >>> 30) & 0x3FFFFFFF);
            int y = (int) (move & 0x3FFFFFFF);
            double delta = moveDelta(toggle, kind, x, y);
            if (patience == 0 && delta <= MIN_IMPROVEMENT) {
                break;
            }
            apply(dag, kind, x, y);
            steps++;
            local[y] = score.localScore(y, dag.parents(y));
            rateColumn(dag, y, local, toggle);
            if (kind == REVERSE) {
                local[x] = score.localScore(x, dag.parents(x));
                rateColumn(dag, x, local, toggle);
            }
            total = 0;
            for (double v : local) {
                total += v;
            }
            long inverse = kind == ADD ? key(REMOVE, x, y) : kind == REMOVE ? key(ADD, x, y) : key(REVERSE, y, x);
            if (tabuLength > 0) {
                tabu.add(inverse);
                tabuOrder.addLast(inverse);
                if (tabuOrder.size() > tabuLength) {
                    tabu.remove(tabuOrder.removeFirst());
                }
            }
            if (total > bestScore + MIN_IMPROVEMENT) {
                bestScore = total;
                bestDag = new Pdag(dag);
                sinceBest = 0;
            } else if (++sinceBest >= patience) {
                break;
            }
        }
        return new Climb(bestDag, bestScore);
    }

    private void rateColumn(Pdag dag, int y, double[] local, double[] toggle) {
        int[] pa = dag.parents(y);
        for (int x = 0; x < p; x++) {
            if (x == y) {
                continue;
            }
            double s;
            if (dag.directed(x, y)) {
                s = score.localScore(y, without(pa, x)) - local[y];
            } else if (pa.length < maxParents) {
                int[] with = Arrays.copyOf(pa, pa.length + 1);
                with[pa.length] = x;
                s = score.localScore(y, with) - local[y];
            } else {
                s = Double.NEGATIVE_INFINITY;
            }
            toggle[x * p + y] = s;
        }
    }

    /** The best legal, allowed move that is not tabu (or beats the best score), or −1. */
    private long bestMove(Pdag dag, double[] toggle, Set<Long> tabu, double total, double bestScore) {
        long[] moves = new long[3 * p * p];
        double[] deltas = new double[moves.length];
        int n = 0;
        int top = -1;
        for (int x = 0; x < p; x++) {
            for (int y = 0; y < p; y++) {
                if (x == y) {
                    continue;
                }
                boolean directed = dag.directed(x, y);
                int kinds = directed ? 2 : dag.adjacent(x, y) ? 0 : 1;
                for (int kk = 0; kk < kinds; kk++) {
                    int kind = directed ? (kk == 0 ? REMOVE : REVERSE) : ADD;
                    if (!allowed(kind, x, y)) {
                        continue;
                    }
                    double d = moveDelta(toggle, kind, x, y);
                    if (d == Double.NEGATIVE_INFINITY) {
                        continue;
                    }
                    long k = key(kind, x, y);
                    if (tabu.contains(k) && !(total + d > bestScore + MIN_IMPROVEMENT)) {
                        continue;
                    }
                    moves[n] = k;
                    deltas[n] = d;
                    if (top < 0 || d > deltas[top]) {
                        top = n;
                    }
                    n++;
                }
            }
        }
        if (top < 0) {
            return -1;
        }
        if (isLegal(dag, moves[top])) {
            return moves[top];
        }
        // The best rating would close a cycle: try the others best first (rare, so sorting is affordable).
        Integer[] order = new Integer[n];
        for (int i = 0; i < n; i++) {
            order[i] = i;
        }
        Arrays.sort(order, (a, b) -> {
            int c = Double.compare(deltas[b], deltas[a]);
            return c != 0 ? c : Long.compare(moves[a], moves[b]);
        });
        for (Integer i : order) {
            if (isLegal(dag, moves[i])) {
                return moves[i];
            }
        }
        return -1;
    }

    private boolean isLegal(Pdag dag, long move) {
        int kind = (int) (move >>> 60);
        int x = (int) ((move >>> 30) & 0x3FFFFFFF);
        int y = (int) (move & 0x3FFFFFFF);
        return keepsAcyclic(dag, kind, x, y);
    }

    private boolean allowed(int kind, int x, int y) {
        switch (kind) {
            case ADD:
                return !knowledge.isForbidden(x, y);
            case REMOVE:
                return !knowledge.isRequired(x, y);
            default:
                return !knowledge.isRequired(x, y) && !knowledge.isForbidden(y, x);
        }
    }

    private double moveDelta(double[] toggle, int kind, int x, int y) {
        if (kind == REVERSE) {
            return toggle[x * p + y] + toggle[y * p + x];
        }
        return toggle[x * p + y];
    }

    private boolean keepsAcyclic(Pdag dag, int kind, int x, int y) {
        if (kind == REMOVE) {
            return true;
        }
        if (kind == ADD) {
            return !dag.directedPath(y, x, -1, -1);
        }
        // reversing x → y is acyclic unless another directed path x ⇝ y exists
        return !dag.directedPath(x, y, x, y);
    }

    private static void apply(Pdag dag, int kind, int x, int y) {
        switch (kind) {
            case ADD:
                dag.addDirected(x, y);
                break;
            case REMOVE:
                dag.remove(x, y);
                break;
            default:
                dag.orient(y, x);
                break;
        }
    }

    private Pdag perturb(Pdag from, UniformRandomProvider rng) {
        Pdag dag = new Pdag(from);
        dag.perturb(rng, perturbation, (g, x, y) -> {
            int kind;
            if (g.directed(x, y)) {
                kind = rng.nextBoolean() ? REMOVE : REVERSE;
            } else if (!g.adjacent(x, y)) {
                kind = ADD;
                if (g.parents(y).length >= maxParents) {
                    return false;
                }
            } else {
                return false;
            }
            if (kind == REVERSE && g.parents(x).length >= maxParents) {
                return false;
            }
            if (allowed(kind, x, y) && keepsAcyclic(g, kind, x, y)) {
                apply(g, kind, x, y);
                return true;
            }
            return false;
        });
        return dag;
    }

    private static long key(int kind, int x, int y) {
        return ((long) kind << 60) | ((long) x << 30) | y;
    }

    private static int[] without(int[] a, int x) {
        int[] out = new int[a.length - 1];
        int n = 0;
        for (int v : a) {
            if (v != x) {
                out[n++] = v;
            }
        }
        return out;
    }
}

package dev.touchstone.learners.score;

import java.util.ArrayDeque;

/**
 * Re-completes the PDAG left by a GES move: a consistent DAG extension (Dor and Tarsi 1992,
 * "A simple algorithm to construct a consistent extension of a partially oriented graph"),
 * then the CPDAG of that DAG — skeleton, v-structures, and Meek's rules R1–R3 to closure
 * (Meek 1995, "Causal inference and causal explanation with background knowledge") — then,
 * when there is background knowledge, the orientations it demands and Meek's R1–R4 again.
 *
 * <p>Cost: the extension visits each node once with a queue, O(Σ deg²); the rules run to a
 * fixpoint, O(rounds · Σ deg²). Works on {@link Pdag} directly so a move costs no graph
 * conversions.
 */
final class CpdagCompletion implements GesSearch.Completion {

    private final KnowledgeIndex knowledge;

    CpdagCompletion(KnowledgeIndex knowledge) {
        this.knowledge = knowledge;
    }

    @Override
    public Pdag complete(Pdag pdag) {
        Pdag dag = extension(pdag);
        Pdag cpdag = cpdagOf(dag);
        if (!knowledge.isEmpty()) {
            orientByKnowledge(cpdag);
            meek(cpdag, true);
        }
        return cpdag;
    }

    /**
     * A DAG with the same skeleton and v-structures as {@code pdag} that keeps its directed
     * edges (Dor and Tarsi 1992).
     *
     * @throws IllegalStateException when there is none (GES's valid operators never lead there)
     */
    static Pdag extension(Pdag pdag) {
        int p = pdag.size();
        Pdag work = new Pdag(pdag);
        Pdag out = new Pdag(pdag);
        boolean[] removed = new boolean[p];
        ArrayDeque<Integer> queue = new ArrayDeque<>();
        boolean[] queued = new boolean[p];
        for (int v = 0; v < p; v++) {
            queue.add(v);
            queued[v] = true;
        }
        int left = p;
        int sinceProgress = 0;
        while (!queue.isEmpty()) {
            int x = queue.poll();
            queued[x] = false;
            if (removed[x]) {
                continue;
            }
            if (!isRemovable(work, x)) {
                if (++sinceProgress > queue.size() + 1) {
                    break;
                }
                queue.add(x);
                queued[x] = true;
                continue;
            }
            sinceProgress = 0;
            int[] nbrs = new int[work.degree(x)];
            for (int k = 0; k < nbrs.length; k++) {
                nbrs[k] = work.neighbour(x, k);
            }
            for (int y : nbrs) {
                if (work.undirected(x, y)) {
                    out.orient(y, x);
                }
                work.remove(x, y);
                if (!queued[y]) {
                    queue.add(y);
                    queued[y] = true;
                }
            }
            removed[x] = true;
            left--;
        }
        if (left > 0) {
            throw new IllegalStateException("the PDAG has no consistent extension");
        }
        return out;
    }

    /** A sink whose undirected neighbours are each adjacent to all of its other neighbours. */
    private static boolean isRemovable(Pdag g, int x) {
        int d = g.degree(x);
        for (int k = 0; k < d; k++) {
            if (g.directed(x, g.neighbour(x, k))) {
                return false;
            }
        }
        for (int k = 0; k < d; k++) {
            int y = g.neighbour(x, k);
            if (!g.undirected(x, y)) {
                continue;
            }
            for (int m = 0; m < d; m++) {
                int z = g.neighbour(x, m);
                if (z != y && !g.adjacent(y, z)) {
                    return false;
                }
            }
        }
        return true;
    }

    /** The CPDAG of a DAG: v-structures directed, everything else undirected, then Meek's R1–R3. */
    static Pdag cpdagOf(Pdag dag) {
        int p = dag.size();
        Pdag out = new Pdag(p);
        for (int a = 0; a < p; a++) {
            for (int k = 0; k < dag.degree(a); k++) {
                int b = dag.neighbour(a, k);
                if (a < b) {
                    out.addUndirected(a, b);
                }
            }
        }
        for (int c = 0; c < p; c++) {
            int[] pa = dag.parents(c);
            for (int i = 0; i < pa.length; i++) {
                for (int j = i + 1; j < pa.length; j++) {
                    if (!dag.adjacent(pa[i], pa[j])) {
                        out.orient(pa[i], c);
                        out.orient(pa[j], c);
                    }
                }
            }
        }
        meek(out, false);
        return out;
    }

    private void orientByKnowledge(Pdag g) {
        int p = g.size();
        for (int a = 0; a < p; a++) {
            for (int k = 0; k < g.degree(a); k++) {
                int b = g.neighbour(a, k);
                if (g.undirected(a, b) && (knowledge.isRequired(a, b) || knowledge.isForbidden(b, a))) {
                    g.orient(a, b);
                }
            }
        }
    }

    /** Applies Meek's rules R1–R3 (and R4 when {@code withR4}) until nothing changes. */
    static void meek(Pdag g, boolean withR4) {
        int p = g.size();
        boolean changed = true;
        while (changed) {
            changed = false;
            for (int a = 0; a < p; a++) {
                for (int k = 0; k < g.degree(a); k++) {
                    int b = g.neighbour(a, k);
                    if (g.undirected(a, b) && orientsTo(g, a, b, withR4)) {
                        g.orient(a, b);
                        changed = true;
                    }
                }
            }
        }
    }

    /** Whether one of the rules directs the undirected edge a — b as a → b. */
    private static boolean orientsTo(Pdag g, int a, int b, boolean withR4) {
        int da = g.degree(a);
        int db = g.degree(b);
        // R1: c → a — b, c and b not adjacent
        for (int k = 0; k < da; k++) {
            int c = g.neighbour(a, k);
            if (g.directed(c, a) && !g.adjacent(c, b)) {
                return true;
            }
        }
        // R2: a → c → b
        for (int k = 0; k < da; k++) {
            int c = g.neighbour(a, k);
            if (g.directed(a, c) && g.directed(c, b)) {
                return true;
            }
        }
        // R3: a — c → b, a — d → b, c and d not adjacent
        for (int k = 0; k < db; k++) {
            int c = g.neighbour(b, k);
            if (!g.directed(c, b) || !g.undirected(a, c)) {
                continue;
            }
            for (int m = k + 1; m < db; m++) {
                int d = g.neighbour(b, m);
                if (g.directed(d, b) && g.undirected(a, d) && !g.adjacent(c, d)) {
                    return true;
                }
            }
        }
        if (!withR4) {
            return false;
        }
        // R4: a — d → c → b, a adjacent to c, d and b not adjacent
        for (int k = 0; k < db; k++) {
            int c = g.neighbour(b, k);
            if (!g.directed(c, b) || !g.adjacent(a, c)) {
                continue;
            }
            for (int m = 0; m < g.degree(c); m++) {
                int d = g.neighbour(c, m);
                if (d != a && g.directed(d, c) && g.undirected(a, d) && !g.adjacent(d, b)) {
                    return true;
                }
            }
        }
        return false;
    }
}

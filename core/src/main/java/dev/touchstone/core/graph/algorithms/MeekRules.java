package dev.touchstone.core.graph.algorithms;

import dev.touchstone.core.graph.Graph;
import dev.touchstone.core.graph.MutableGraph;
import dev.touchstone.core.knowledge.Knowledge;

import java.util.ArrayList;
import java.util.Arrays;
import java.util.List;
import java.util.Objects;

/**
 * Meek's orientation rules R1–R4 with background knowledge (Meek 1995, "Causal inference
 * and causal explanation with background knowledge", UAI): orients the undirected edges of
 * a partially directed graph to closure. On a PDAG that has a consistent DAG extension the
 * result is the maximally oriented graph: an undirected edge is oriented exactly when all
 * consistent extensions that respect the knowledge orient it the same way (Meek 1995,
 * Theorems 2–4), so it does not depend on the order in which rules fire.
 *
 * <p>The rules, for an undirected edge a — b (orient it a → b when):
 * <ul>
 *   <li>R1: some c → a with c, b not adjacent;</li>
 *   <li>R2: some a → c → b;</li>
 *   <li>R3: two non-adjacent c, d with a — c → b and a — d → b;</li>
 *   <li>R4: some a — c → d → b with c, b not adjacent and a, d adjacent.</li>
 * </ul>
 *
 * <p><b>Contract.</b>
 * <ol>
 *   <li>The input must have only directed and undirected edges (else
 *       {@link IllegalArgumentException} naming the edge). Adjacencies never change;
 *       directed edges of the input are never changed or reversed.</li>
 *   <li>Knowledge is applied first, to undirected edges only: a required direction
 *       ({@link Knowledge#isRequired}) is oriented; then an edge with exactly one direction
 *       forbidden ({@link Knowledge#isForbidden}, which includes tiers) is oriented the
 *       other way. Knowledge about non-adjacent pairs or unknown names is ignored (the
 *       adjacency search decides adjacencies; {@link Knowledge#checkVariables} checks names).</li>
 *   <li>Then R1–R4 run to closure, driven by a worklist: only undirected edges near a newly
 *       oriented edge are re-examined, so the cost is about O(|E| + k·Δ³) for k
 *       orientations and maximum degree Δ, not repeated sweeps over the graph.</li>
 *   <li>Conflicts are resolved as follows and each one is reported once in
 *       {@link Outcome#conflicts()}: a required direction opposite to a directed input edge
 *       keeps the input edge; a directed input edge that knowledge forbids is kept; an
 *       undirected edge with both directions forbidden stays undirected and is never
 *       oriented by the rules; an undirected edge for which the rules imply both directions
 *       at once stays undirected. No conflict arises on a PDAG with a consistent extension
 *       that respects the knowledge.</li>
 *   <li>On a PDAG with no consistent extension the rules can create a directed cycle and the
 *       result can depend on processing order; that order is fixed (edges by index, then
 *       first in first out), so the result is reproducible. Check with
 *       {@link DagExtension#of} where it matters.</li>
 * </ol>
 */
public final class MeekRules {

    private MeekRules() {
    }

    /**
     * What {@link #apply(MutableGraph, Knowledge)} did.
     *
     * @param oriented  the number of undirected edges it oriented (knowledge and rules)
     * @param conflicts one line per conflict met, in the order met, naming the edge and the
     *                  choice made; empty when there were none
     */
    public record Outcome(int oriented, List<String> conflicts) {
        public Outcome {
            conflicts = List.copyOf(conflicts);
        }

        /** Whether no conflict was met. */
        public boolean consistent() {
            return conflicts.isEmpty();
        }
    }

    /**
     * Orients {@code pdag} in place to closure under background knowledge and R1–R4
     * (see the class comment for the exact contract).
     *
     * @return how many edges were oriented and which conflicts were met
     * @throws IllegalArgumentException if an edge is neither directed nor undirected
     */
    public static Outcome apply(MutableGraph pdag, Knowledge knowledge) {
        Objects.requireNonNull(knowledge, "knowledge");
        Graph snapshot = pdag.freeze();
        PdagArrays p = PdagArrays.of(snapshot);
        byte[] before = p.state.clone();
        List<String> conflicts = new ArrayList<>();
        boolean[] frozen = knowledge.isEmpty() ? null : applyKnowledge(p, knowledge, conflicts);
        close(p, frozen, conflicts);
        int oriented = 0;
        for (int s = 0; s < p.state.length; s++) {
            int v = p.owner[s];
            int w = p.neighbours[s];
            if (v < w && p.state[s] != before[s]) {
                oriented++;
                if (p.state[s] == PdagArrays.OUT) {
                    pdag.orient(v, w);
                } else {
                    pdag.orient(w, v);
                }
            }
        }
        return new Outcome(oriented, conflicts);
    }

    /** The closure of {@code pdag} under R1–R4, without background knowledge. */
    public static Graph apply(Graph pdag) {
        PdagArrays p = PdagArrays.of(pdag);
        close(p, null, new ArrayList<>());
        return p.toGraph();
    }

    /** The closure of {@code pdag} under the knowledge and R1–R4; conflicts are resolved as documented. */
    public static Graph apply(Graph pdag, Knowledge knowledge) {
        MutableGraph m = pdag.toMutable();
        apply(m, knowledge);
        return m.freeze();
    }

    /** Orients undirected edges by the knowledge; returns the slots of edges never to orient. */
    private static boolean[] applyKnowledge(PdagArrays p, Knowledge knowledge, List<String> conflicts) {
        Graph g = p.source;
        boolean[] frozen = new boolean[p.state.length];
        for (Knowledge.DirectedPair r : knowledge.required()) {
            int from = g.indexOf(r.from());
            int to = g.indexOf(r.to());
            int s = from < 0 || to < 0 ? -1 : p.slot(from, to);
            if (s < 0) {
                continue;
            }
            if (p.state[s] == PdagArrays.UNDIRECTED) {
                p.orientOut(s);
            } else if (p.state[s] == PdagArrays.IN) {
                conflicts.add("required " + r.from() + " -> " + r.to() + " but the graph has " + r.to()
                        + " -> " + r.from() + "; kept " + r.to() + " -> " + r.from());
            }
        }
        if (knowledge.forbidden().isEmpty() && knowledge.tiers().isEmpty()) {
            return frozen;
        }
        for (int s = 0; s < p.state.length; s++) {
            int a = p.owner[s];
            int b = p.neighbours[s];
            if (a > b) {
                continue;
            }
            boolean ab = knowledge.isForbidden(g.name(a), g.name(b));
            boolean ba = knowledge.isForbidden(g.name(b), g.name(a));
            if (p.state[s] == PdagArrays.UNDIRECTED) {
                if (ab && ba) {
                    frozen[s] = true;
                    frozen[p.twin[s]] = true;
                    conflicts.add("both directions of " + g.name(a) + " --- " + g.name(b)
                            + " are forbidden; left undirected");
                } else if (ab) {
                    p.orientOut(p.twin[s]);
                } else if (ba) {
                    p.orientOut(s);
                }
            } else {
                boolean out = p.state[s] == PdagArrays.OUT;
                if (out ? ab : ba) {
                    String from = g.name(out ? a : b);
                    String to = g.name(out ? b : a);
                    conflicts.add("the graph has " + from + " -> " + to + ", which the knowledge forbids; kept it");
                }
            }
        }
        return frozen;
    }

    /**
     * Applies R1–R4 to closure on {@code p}. Every undirected edge is examined once; after
     * that an edge is examined again only when a newly oriented edge could complete the
     * antecedent of a rule for it. The antecedents need directed edges (which only appear),
     * undirected edges (which only disappear) and adjacencies (fixed), so a rule can become
     * applicable only through a new directed edge u → v, and the edges it can then orient are:
     * undirected edges at v (R1, R2, R3, R4 via d → b), at u (R2 via a → c), and at an
     * undirected neighbour of u adjacent to v (R4 via c → d).
     */
    static void close(PdagArrays p, boolean[] frozen, List<String> conflicts) {
        new Closure(p, frozen, conflicts).run();
    }

    private static final class Closure {
        private final PdagArrays p;
        private final boolean[] frozen;
        private final List<String> conflicts;
        private final boolean[] queued;
        private boolean[] reported;
        private final int[] ring;
        private int head;
        private int count;
        private int[] scratch = new int[8];

        Closure(PdagArrays p, boolean[] frozen, List<String> conflicts) {
            this.p = p;
            this.frozen = frozen;
            this.conflicts = conflicts;
            this.queued = new boolean[p.state.length];
            // Each edge is queued at most once at a time, by its canonical slot.
            this.ring = new int[p.state.length / 2 + 1];
        }

        void run() {
            for (int s = 0; s < p.state.length; s++) {
                if (p.owner[s] < p.neighbours[s]) {
                    offer(s);
                }
            }
            while (count > 0) {
                int s = ring[head];
                head = head + 1 == ring.length ? 0 : head + 1;
                count--;
                queued[s] = false;
                if (p.state[s] != PdagArrays.UNDIRECTED) {
                    continue;
                }
                int a = p.owner[s];
                int b = p.neighbours[s];
                boolean ab = implied(a, b);
                boolean ba = implied(b, a);
                if (ab && ba) {
                    report(s, a, b);
                } else if (ab) {
                    p.orientOut(s);
                    wake(a, b);
                } else if (ba) {
                    p.orientOut(p.twin[s]);
                    wake(b, a);
                }
            }
        }

        private void report(int s, int a, int b) {
            if (reported == null) {
                reported = new boolean[p.state.length];
            }
            if (!reported[s]) {
                reported[s] = true;
                Graph g = p.source;
                conflicts.add("the rules imply both " + g.name(a) + " -> " + g.name(b) + " and " + g.name(b)
                        + " -> " + g.name(a) + "; left " + g.name(a) + " --- " + g.name(b) + " undirected");
            }
        }

        /** Queues the undirected edge of slot s (either twin) unless it is queued or frozen. */
        private void offer(int s) {
            int c = p.owner[s] < p.neighbours[s] ? s : p.twin[s];
            if (queued[c] || p.state[c] != PdagArrays.UNDIRECTED || (frozen != null && frozen[c])) {
                return;
            }
            queued[c] = true;
            int tail = head + count;
            ring[tail >= ring.length ? tail - ring.length : tail] = c;
            count++;
        }

        private void offerUndirectedAt(int v) {
            for (int s = p.offsets[v], e = p.offsets[v + 1]; s < e; s++) {
                if (p.state[s] == PdagArrays.UNDIRECTED) {
                    offer(s);
                }
            }
        }

        /** After orienting u → v: queue every undirected edge a rule could now orient. */
        private void wake(int u, int v) {
            offerUndirectedAt(v);
            offerUndirectedAt(u);
            for (int s = p.offsets[u], e = p.offsets[u + 1]; s < e; s++) {
                int a = p.neighbours[s];
                if (p.state[s] == PdagArrays.UNDIRECTED && p.adjacent(a, v)) {
                    offerUndirectedAt(a);
                }
            }
        }

        /** Whether some rule orients the undirected edge a — b as a → b. */
        private boolean implied(int a, int b) {
            byte[] st = p.state;
            int[] nb = p.neighbours;
            // R1: c → a — b, c and b not adjacent.  R2: a → c → b.
            for (int s = p.offsets[a], e = p.offsets[a + 1]; s < e; s++) {
                int c = nb[s];
                if (st[s] == PdagArrays.IN) {
                    if (!p.adjacent(c, b)) {
                        return true;
                    }
                } else if (st[s] == PdagArrays.OUT) {
                    if (p.isDirected(c, b)) {
                        return true;
                    }
                }
            }
            // R3: a — c → b and a — d → b with c, d not adjacent.
            // R4: a — c → d → b with c, b not adjacent and a, d adjacent.
            int m = 0;
            for (int s = p.offsets[b], e = p.offsets[b + 1]; s < e; s++) {
                if (st[s] != PdagArrays.IN) {
                    continue;
                }
                int d = nb[s];
                int ad = p.slot(a, d);
                if (ad < 0) {
                    continue;
                }
                if (st[ad] == PdagArrays.UNDIRECTED) {
                    for (int i = 0; i < m; i++) {
                        if (!p.adjacent(scratch[i], d)) {
                            return true;
                        }
                    }
                    if (m == scratch.length) {
                        scratch = Arrays.copyOf(scratch, 2 * m);
                    }
                    scratch[m++] = d;
                }
                for (int t = p.offsets[d], f = p.offsets[d + 1]; t < f; t++) {
                    if (st[t] == PdagArrays.IN) {
                        int c = nb[t];
                        if (c != a && p.isUndirected(a, c) && !p.adjacent(c, b)) {
                            return true;
                        }
                    }
                }
            }
            return false;
        }
    }
}

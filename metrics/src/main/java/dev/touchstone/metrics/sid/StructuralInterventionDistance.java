package dev.touchstone.metrics.sid;

import dev.touchstone.core.graph.Edge;
import dev.touchstone.core.graph.Graph;
import dev.touchstone.core.graph.Mark;

import java.util.ArrayList;
import java.util.List;

/**
 * The structural intervention distance (SID) of Peters and Bühlmann (2015, "Structural
 * intervention distance for evaluating causal graphs", Neural Computation 27): the number of
 * ordered pairs (i, j), i ≠ j, for which the intervention distribution p(x_j | do(x_i)) inferred
 * from the estimate H by adjusting for H's parents of i is wrong for some distribution Markov to
 * the true DAG G.
 *
 * <p>With Z = Pa_H(i): if j ∈ Z, H says intervening on i leaves j alone, which is right iff j is
 * not a descendant of i in G. Otherwise the inference is right iff Z is an adjustment set for
 * (i, j) in G (Shpitser, VanderWeele and Robins 2010): (a) Z holds no descendant of a node W ≠ i
 * on a causal path from i to j, and (b) Z d-separates i and j in the proper back-door graph
 * (van der Zander, Liśkiewicz and Textor 2014). Both are decided here for all j at once:
 * (a) fails exactly for the descendants of those children of i that are ancestors of Z; and given
 * (a), (b) holds iff i and j are d-separated by Z in G with the edges i → c removed for every
 * child c of i that is not an ancestor of Z (paths through such c are blocked anyway, and the
 * edges into ancestors of Z are never removed in the proper back-door graph of a j passing (a)).
 * One reachability pass (Bayes-ball; Shachter 1998) answers (b) for every j.
 *
 * <p>For a CPDAG estimate every node i may have any parent set Pa_H(i) ∪ S with S a clique of its
 * undirected neighbours (no new v-structure at i); the bounds are the sums over i of the fewest
 * and the most wrong pairs over those sets, as Peters and Bühlmann define them. Every DAG in the
 * class picks one of these sets at every node, so its SID lies within the bounds.
 *
 * <p>Cost: O(p (p + E)) for a DAG estimate, times the number of candidate parent sets per node for
 * a CPDAG; O(p + E) memory.
 */
public final class StructuralInterventionDistance {

    /** Candidate parent sets allowed at one node before the computation is refused. */
    static final int MAX_CANDIDATES = 1 << 16;

    private final int p;
    private final int[] chOff;
    private final int[] ch;
    private final int[] paOff;
    private final int[] pa;

    // epoch-stamped work arrays: a slot is "set" when it holds the current epoch
    private final int[] inZ;
    private final int[] anZ;
    private final int[] cz;
    private final int[] forbidden;
    private final int[] descendant;
    private final int[] up;
    private final int[] down;
    private final int[] queue;
    private int epoch;
    private int descEpoch;

    private StructuralInterventionDistance(Graph dag) {
        p = dag.size();
        chOff = new int[p + 1];
        paOff = new int[p + 1];
        for (int v = 0; v < p; v++) {
            int c = 0;
            int q = 0;
            for (int k = 0; k < dag.degree(v); k++) {
                if (dag.markThere(v, k) == Mark.ARROW) {
                    c++;
                } else {
                    q++;
                }
            }
            chOff[v + 1] = chOff[v] + c;
            paOff[v + 1] = paOff[v] + q;
        }
        ch = new int[chOff[p]];
        pa = new int[paOff[p]];
        for (int v = 0; v < p; v++) {
            int c = chOff[v];
            int q = paOff[v];
            for (int k = 0; k < dag.degree(v); k++) {
                if (dag.markThere(v, k) == Mark.ARROW) {
                    ch[c++] = dag.neighbour(v, k);
                } else {
                    pa[q++] = dag.neighbour(v, k);
                }
            }
        }
        inZ = new int[p];
        anZ = new int[p];
        cz = new int[p];
        forbidden = new int[p];
        descendant = new int[p];
        up = new int[p];
        down = new int[p];
        queue = new int[2 * p + 2];
    }

    /**
     * The SID of {@code estimate} (a DAG, or a CPDAG with undirected edges) from {@code trueDag}.
     * Both must be over the same variables in the same order.
     *
     * @throws IllegalArgumentException if the truth is not a DAG, the estimate has an edge that is
     *                                  neither directed nor undirected, or the variables differ
     */
    public static SidResult between(Graph trueDag, Graph estimate) {
        if (!trueDag.names().equals(estimate.names())) {
            throw new IllegalArgumentException("SID needs the true DAG and the estimate over the same variables in the same order");
        }
        if (!trueDag.isFullyDirected()) {
            throw new IllegalArgumentException("SID needs a true DAG, but the truth has edges that are not directed");
        }
        for (int v = 0; v < estimate.size(); v++) {
            for (int k = 0; k < estimate.degree(v); k++) {
                Mark here = estimate.markHere(v, k);
                Mark there = estimate.markThere(v, k);
                if (here == Mark.CIRCLE || there == Mark.CIRCLE || here == Mark.ARROW && there == Mark.ARROW) {
                    Edge e = estimate.edge(v, estimate.neighbour(v, k)).canonical();
                    throw new IllegalArgumentException("SID is defined for DAG and CPDAG estimates; the edge "
                            + estimate.name(e.a()) + " " + e.atA().word() + "-" + e.atB().word() + " "
                            + estimate.name(e.b()) + " is neither directed nor undirected");
                }
            }
        }
        StructuralInterventionDistance sid = new StructuralInterventionDistance(trueDag);
        if (!sid.acyclic()) {
            throw new IllegalArgumentException("SID needs a true DAG, but the truth's directed edges form a cycle");
        }
        return sid.distance(estimate);
    }

    /** Kahn's algorithm over the children lists (Kahn 1962). */
    private boolean acyclic() {
        int[] indegree = new int[p];
        for (int k = 0; k < ch.length; k++) {
            indegree[ch[k]]++;
        }
        int tail = 0;
        for (int v = 0; v < p; v++) {
            if (indegree[v] == 0) {
                queue[tail++] = v;
            }
        }
        for (int head = 0; head < tail; head++) {
            int v = queue[head];
            for (int k = chOff[v]; k < chOff[v + 1]; k++) {
                if (--indegree[ch[k]] == 0) {
                    queue[tail++] = ch[k];
                }
            }
        }
        return tail == p;
    }

    private SidResult distance(Graph h) {
        long lower = 0;
        long upper = 0;
        boolean single = true;
        for (int i = 0; i < p; i++) {
            int[] parents = h.parents(i);
            int[] undirected = h.undirectedNeighbours(i);
            markDescendants(i);
            if (undirected.length == 0) {
                long c = wrongPairs(i, parents);
                lower += c;
                upper += c;
                continue;
            }
            single = false;
            List<int[]> cliques = new ArrayList<>();
            cliques(h, undirected, 0, new int[undirected.length], 0, cliques);
            long min = Long.MAX_VALUE;
            long max = Long.MIN_VALUE;
            for (int[] s : cliques) {
                int[] z = new int[parents.length + s.length];
                System.arraycopy(parents, 0, z, 0, parents.length);
                System.arraycopy(s, 0, z, parents.length, s.length);
                long c = wrongPairs(i, z);
                min = Math.min(min, c);
                max = Math.max(max, c);
            }
            lower += min;
            upper += max;
        }
        return new SidResult(single ? lower : null, lower, upper);
    }

    /** Every clique (the empty one included) of the estimate among {@code nbrs[from…]}, extending {@code chosen}. */
    private static void cliques(Graph h, int[] nbrs, int from, int[] chosen, int size, List<int[]> out) {
        if (out.size() >= MAX_CANDIDATES) {
            throw new IllegalArgumentException("SID bounds refused: a node has more than " + MAX_CANDIDATES
                    + " possible parent sets among its undirected neighbours");
        }
        out.add(java.util.Arrays.copyOf(chosen, size));
        for (int k = from; k < nbrs.length; k++) {
            boolean joined = true;
            for (int m = 0; m < size && joined; m++) {
                joined = h.adjacent(chosen[m], nbrs[k]);
            }
            if (joined) {
                chosen[size] = nbrs[k];
                cliques(h, nbrs, k + 1, chosen, size + 1, out);
            }
        }
    }

    /** Stamps {@code descendant} with the descendants of i in G, i included. */
    private void markDescendants(int i) {
        int e = ++epoch;
        int head = 0;
        int tail = 0;
        descendant[i] = e;
        queue[tail++] = i;
        while (head < tail) {
            int v = queue[head++];
            for (int k = chOff[v]; k < chOff[v + 1]; k++) {
                int c = ch[k];
                if (descendant[c] != e) {
                    descendant[c] = e;
                    queue[tail++] = c;
                }
            }
        }
        descEpoch = e;
    }

    /** The number of j ≠ i whose p(x_j | do(x_i)) is wrongly inferred by adjusting for z. */
    private long wrongPairs(int i, int[] z) {
        int e = ++epoch;
        // ancestors of Z (Z included), by a reverse search
        int head = 0;
        int tail = 0;
        for (int v : z) {
            inZ[v] = e;
            if (anZ[v] != e) {
                anZ[v] = e;
                queue[tail++] = v;
            }
        }
        while (head < tail) {
            int v = queue[head++];
            for (int k = paOff[v]; k < paOff[v + 1]; k++) {
                int q = pa[k];
                if (anZ[q] != e) {
                    anZ[q] = e;
                    queue[tail++] = q;
                }
            }
        }
        // children of i that are ancestors of Z, and their descendants: condition (a) fails there
        head = 0;
        tail = 0;
        for (int k = chOff[i]; k < chOff[i + 1]; k++) {
            int c = ch[k];
            if (anZ[c] == e) {
                cz[c] = e;
                forbidden[c] = e;
                queue[tail++] = c;
            }
        }
        while (head < tail) {
            int v = queue[head++];
            for (int k = chOff[v]; k < chOff[v + 1]; k++) {
                int c = ch[k];
                if (forbidden[c] != e) {
                    forbidden[c] = e;
                    queue[tail++] = c;
                }
            }
        }
        reach(i, e);
        long wrong = 0;
        for (int j = 0; j < p; j++) {
            if (j == i) {
                continue;
            }
            if (inZ[j] == e) {
                if (descendant[j] == descEpoch) {
                    wrong++;
                }
            } else if (forbidden[j] == e || up[j] == e || down[j] == e) {
                wrong++;
            }
        }
        return wrong;
    }

    /**
     * Bayes-ball from i given Z in G without the edges i → c for children c not stamped in
     * {@code cz}; stamps {@code up[v]} (entered from a child) and {@code down[v]} (entered from a
     * parent) for every state reached.
     */
    private void reach(int i, int e) {
        int head = 0;
        int tail = 0;
        // states are encoded as 2v (up) and 2v + 1 (down); the source leaves like an up state
        for (int k = paOff[i]; k < paOff[i + 1]; k++) {
            int q = pa[k];
            if (up[q] != e) {
                up[q] = e;
                queue[tail++] = 2 * q;
            }
        }
        for (int k = chOff[i]; k < chOff[i + 1]; k++) {
            int c = ch[k];
            if (cz[c] == e && down[c] != e) {
                down[c] = e;
                queue[tail++] = 2 * c + 1;
            }
        }
        while (head < tail) {
            int s = queue[head++];
            int v = s >>> 1;
            boolean fromParent = (s & 1) == 1;
            boolean blocked = inZ[v] == e;
            if (!blocked) {
                for (int k = chOff[v]; k < chOff[v + 1]; k++) {
                    int c = ch[k];
                    if (v == i && cz[c] != e) {
                        continue;
                    }
                    if (down[c] != e) {
                        down[c] = e;
                        queue[tail++] = 2 * c + 1;
                    }
                }
            }
            if (fromParent ? anZ[v] == e : !blocked) {
                for (int k = paOff[v]; k < paOff[v + 1]; k++) {
                    int q = pa[k];
                    if (q == i && cz[v] != e) {
                        continue;
                    }
                    if (up[q] != e) {
                        up[q] = e;
                        queue[tail++] = 2 * q;
                    }
                }
            }
        }
    }
}

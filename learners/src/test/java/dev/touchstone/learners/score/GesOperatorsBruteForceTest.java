package dev.touchstone.learners.score;

import dev.touchstone.core.data.DataSet;
import dev.touchstone.core.graph.Graph;
import dev.touchstone.core.graph.MutableGraph;
import dev.touchstone.core.graph.algorithms.Cpdags;
import dev.touchstone.core.testing.RandomDags;
import org.junit.jupiter.api.DisplayName;
import org.junit.jupiter.api.Test;

import java.util.ArrayList;
import java.util.Arrays;
import java.util.List;
import java.util.Map;
import java.util.TreeMap;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

/**
 * Cross-checks GES's operators against brute force on small graphs (p ≤ 6). Chickering
 * (2002, §4) defines Insert(X, Y, T) as adding X → Y to a DAG G of the current class in
 * which the parents of Y among its undirected neighbours are exactly NA_{Y,X} ∪ T, and
 * Delete(X, Y, H) as removing X → Y from a DAG G of the class in which they are exactly
 * (NA_{Y,X} \ H) plus X when X — Y; the operator is valid when such a G exists (and, for
 * Insert, G + X → Y is acyclic) — the definitions as we recall them (from memory), matching
 * the score-change formulas of theorems 15 and 17. The brute force lists every DAG of the class (every
 * orientation of the undirected edges that is acyclic and keeps the CPDAG's v-structures,
 * the definition of a consistent extension, Dor and Tarsi 1992) and derives the valid
 * operators, the class each one reaches (the CPDAG of G ± the edge, Chickering 1995) and
 * its score change (the BIC of G ± the edge minus that of G, summed from scratch). These
 * must equal what the search enumerates under theorems 15 and 17 and what its move and
 * re-completion produce.
 */
class GesOperatorsBruteForceTest {

    private static final double TOLERANCE = 1e-6;

    /** What brute force expects of one operator: its score change and the class it reaches. */
    private record Expected(double delta, Graph cpdag) {
    }

    static String key(int[] set) {
        int[] s = set.clone();
        Arrays.sort(s);
        return Arrays.toString(s);
    }

    @Test
    @DisplayName("on 60 seeded CPDAGs of 4 to 6 nodes the valid Inserts and Deletes, their score changes and the"
            + " classes they reach equal those found by brute force over the DAGs of the class"
            + " (Chickering 2002, §4 and theorems 15 and 17)")
    void operatorsMatchBruteForce() {
        int inserts = 0;
        int deletes = 0;
        int excluded = 0;
        for (long seed = 1; seed <= 60; seed++) {
            int p = 4 + (int) (seed % 3);
            DataSet data = ScoreData.linearGaussian(p, 2.0, 300, 500 + seed);
            List<String> names = data.names();
            BicScore bic = BicScore.of(data.covariance(), 1.0);
            Graph state = RandomDags.erdosRenyi(p, 1.5 + (seed % 4) * 0.5, 900 + seed);
            Pdag current = Pdag.of(Cpdags.of(state));
            List<boolean[][]> members = classMembers(current);
            GesSearch search = ScoreTesting.gesSearch(bic, names);
            search.startAt(current);
            for (int x0 = 0; x0 < p; x0++) {
                for (int y0 = 0; y0 < p; y0++) {
                    int x = x0;
                    int y = y0;
                    if (x == y || (current.adjacent(x, y) && !current.directed(x, y) && !current.undirected(x, y))) {
                        continue;
                    }
                    boolean insert = !current.adjacent(x, y);
                    int[] na = Arrays.stream(current.undirectedNeighbours(y))
                            .filter(z -> z != x && current.adjacent(z, x)).toArray();
                    Map<String, Expected> expected = new TreeMap<>();
                    for (boolean[][] g : members) {
                        if (!insert && !g[x][y]) {
                            continue;
                        }
                        int[] fromNeighbours = Arrays.stream(current.undirectedNeighbours(y))
                                .filter(z -> z != x && g[z][y]).toArray();
                        boolean coversNa = !insert || Arrays.stream(na).allMatch(z -> g[z][y]);
                        boolean[][] changed = copy(g);
                        changed[x][y] = insert;
                        if (!coversNa || !acyclic(changed, p)) {
                            excluded++;
                            continue;
                        }
                        // Insert: T = the parents among the neighbours beyond NA; Delete: H = NA minus those kept
                        int[] set = insert
                                ? Arrays.stream(fromNeighbours).filter(z -> !contains(na, z)).toArray()
                                : Arrays.stream(na).filter(z -> !contains(fromNeighbours, z)).toArray();
                        if (!insert && fromNeighbours.length != na.length - set.length) {
                            excluded++; // a parent among the neighbours that is not in NA: not a Delete's G
                            continue;
                        }
                        double delta = ScoreTesting.dagScore(bic, toGraph(changed, names))
                                - ScoreTesting.dagScore(bic, toGraph(g, names));
                        Expected e = new Expected(delta, Cpdags.of(toGraph(changed, names)));
                        Expected before = expected.putIfAbsent(key(set), e);
                        if (before != null) {
                            assertEquals(before.cpdag(), e.cpdag(), "two DAGs give different classes for one operator");
                        }
                    }
                    String where = (insert ? "Insert" : "Delete") + " at seed " + seed + ", state " + state
                            + ", x=" + x + ", y=" + y;
                    List<GesSearch.Candidate> got = insert ? search.validInserts(x, y) : search.validDeletes(x, y);
                    Map<String, GesSearch.Candidate> byKey = new TreeMap<>();
                    for (GesSearch.Candidate c : got) {
                        byKey.put(key(c.set), c);
                    }
                    assertEquals(expected.keySet(), byKey.keySet(), "valid sets differ: " + where);
                    for (Map.Entry<String, Expected> e : expected.entrySet()) {
                        GesSearch.Candidate c = byKey.get(e.getKey());
                        assertEquals(e.getValue().delta(), c.delta, TOLERANCE, "score change of " + e.getKey() + ", " + where);
                        Pdag after = insert ? search.afterInsert(c) : search.afterDelete(c);
                        assertEquals(e.getValue().cpdag(), after.toGraph(names), "class reached by " + e.getKey() + ", " + where);
                    }
                    if (insert) {
                        inserts += got.size();
                    } else {
                        deletes += got.size();
                    }
                }
            }
        }
        // the check must have seen both operators, and DAGs of the class that give no operator
        assertTrue(inserts > 500 && deletes > 100 && excluded > 20,
                "too few operators checked: " + inserts + " inserts, " + deletes + " deletes, " + excluded + " excluded");
    }

    private static boolean contains(int[] a, int v) {
        for (int x : a) {
            if (x == v) {
                return true;
            }
        }
        return false;
    }

    static boolean[][] copy(boolean[][] g) {
        boolean[][] out = new boolean[g.length][];
        for (int i = 0; i < g.length; i++) {
            out[i] = g[i].clone();
        }
        return out;
    }

    static Graph toGraph(boolean[][] arrow, List<String> names) {
        MutableGraph g = Graph.builder(names);
        for (int a = 0; a < arrow.length; a++) {
            for (int b = 0; b < arrow.length; b++) {
                if (arrow[a][b]) {
                    g.addDirected(a, b);
                }
            }
        }
        return g.freeze();
    }

    /**
     * Every DAG of the class of a CPDAG, by exhaustion: each orientation of the undirected
     * edges that is acyclic and has exactly the CPDAG's v-structures (a consistent extension).
     */
    static List<boolean[][]> classMembers(Pdag pdag) {
        int p = pdag.size();
        List<int[]> undirected = new ArrayList<>();
        for (int a = 0; a < p; a++) {
            for (int b = a + 1; b < p; b++) {
                if (pdag.undirected(a, b)) {
                    undirected.add(new int[] {a, b});
                }
            }
        }
        String vStructures = vStructures(arrows(pdag, p, null, 0), pdag, p);
        List<boolean[][]> out = new ArrayList<>();
        for (long mask = 0; mask < 1L << undirected.size(); mask++) {
            boolean[][] arrow = arrows(pdag, p, undirected, mask);
            if (acyclic(arrow, p) && vStructures(arrow, pdag, p).equals(vStructures)) {
                out.add(arrow);
            }
        }
        assertTrue(!out.isEmpty(), "a CPDAG with no DAG in its class");
        return out;
    }

    /** arrow[a][b]: a → b, from the PDAG's directed edges and the chosen orientation of its undirected ones. */
    private static boolean[][] arrows(Pdag pdag, int p, List<int[]> undirected, long mask) {
        boolean[][] arrow = new boolean[p][p];
        for (int a = 0; a < p; a++) {
            for (int b = 0; b < p; b++) {
                arrow[a][b] = pdag.directed(a, b);
            }
        }
        if (undirected != null) {
            for (int i = 0; i < undirected.size(); i++) {
                int[] e = undirected.get(i);
                if ((mask >> i & 1) == 0) {
                    arrow[e[0]][e[1]] = true;
                } else {
                    arrow[e[1]][e[0]] = true;
                }
            }
        }
        return arrow;
    }

    /** The unshielded colliders a → c ← b (a < b not adjacent), as text. */
    private static String vStructures(boolean[][] arrow, Pdag pdag, int p) {
        StringBuilder sb = new StringBuilder();
        for (int c = 0; c < p; c++) {
            for (int a = 0; a < p; a++) {
                for (int b = a + 1; b < p; b++) {
                    if (arrow[a][c] && arrow[b][c] && !pdag.adjacent(a, b)) {
                        sb.append(a).append('>').append(c).append('<').append(b).append(' ');
                    }
                }
            }
        }
        return sb.toString();
    }

    static boolean acyclic(boolean[][] arrow, int p) {
        int[] indegree = new int[p];
        for (int a = 0; a < p; a++) {
            for (int b = 0; b < p; b++) {
                if (arrow[a][b]) {
                    indegree[b]++;
                }
            }
        }
        int[] stack = new int[p];
        int top = 0;
        for (int v = 0; v < p; v++) {
            if (indegree[v] == 0) {
                stack[top++] = v;
            }
        }
        int seen = 0;
        while (top > 0) {
            int v = stack[--top];
            seen++;
            for (int w = 0; w < p; w++) {
                if (arrow[v][w] && --indegree[w] == 0) {
                    stack[top++] = w;
                }
            }
        }
        return seen == p;
    }
}

package dev.touchstone.core.graph.algorithms;

import dev.touchstone.core.graph.Mark;
import dev.touchstone.core.graph.MutableGraph;

import java.util.ArrayDeque;
import java.util.Arrays;
import java.util.Collections;
import java.util.EnumSet;
import java.util.Set;

/**
 * The orientation rules for partial ancestral graphs of Zhang (2008, "On the completeness of
 * orientation rules for causal discovery in the presence of latent confounders and
 * selection bias", Artificial Intelligence 172, §3): R0 (unshielded colliders), R1–R4
 * (R4 on discriminating paths), R5–R7 (for selection bias) and R8–R10 (tails).
 *
 * <p>Used both to build the true PAG ({@link Pags}) and by FCI-style learners: the rules
 * work on a {@link MutableGraph} whose marks are tails, arrows and circles, and ask a
 * {@link SeparationInfo} whenever a collider decision is needed (R0, R4). Zhang shows that
 * R0–R10 applied to closure are sound and complete, and that without selection bias R0–R4
 * with R8–R10 are (his §4); {@link #withoutSelectionBias()} leaves R5–R7 out, as
 * Touchstone's truths never have selection variables. The closure applies R1–R4 until
 * none fires, then one pass of each of the remaining rules, and starts over while anything
 * changed; the result does not depend on the order because the complete rules reach the
 * unique maximally informative PAG.
 *
 * <p>Rules only ever replace circle marks. A rule whose conclusion contradicts a mark
 * already present (which cannot happen with correct separation information, but can with
 * the errors of finite-sample tests) is not applied, so every call terminates after at most
 * one change per circle. Background knowledge is not taken here; a learner can set marks
 * it knows (for example an arrowhead at the later variable of two tiers) before or between
 * calls, and the rules respect them.
 *
 * <p>Cost: each call first takes a sorted snapshot of the adjacencies (the rules never add
 * or remove edges) with a mirror of the marks, and an adjacency bit matrix for up to 4096
 * variables, so adjacency tests are O(1) and mark look-ups O(log degree). One pass of
 * R0–R3 or R8 is O(Σ deg(v)²) adjacency tests; R4 runs one
 * breadth-first search, O(|V| + |E|), per candidate triple; R5, R9 and R10 search for
 * uncovered paths with a depth-first search over simple paths, which is exponential in the
 * worst case but, after a linear-time walk-reachability filter, cheap on sparse graphs.
 * Instances are immutable and thread-safe; the graph passed in is changed in place.
 */
public final class PagRules {

    /** One of Zhang's rules R1–R10 (R0 is {@link #orientColliders}). */
    public enum Rule { R1, R2, R3, R4, R5, R6, R7, R8, R9, R10 }

    private final Set<Rule> rules;

    private PagRules(Set<Rule> rules) {
        EnumSet<Rule> copy = EnumSet.noneOf(Rule.class);
        copy.addAll(rules);
        this.rules = Collections.unmodifiableSet(copy);
    }

    /** All of R1–R10: complete when selection bias may be present (Zhang 2008, main theorem; from memory). */
    public static PagRules complete() {
        return new PagRules(EnumSet.allOf(Rule.class));
    }

    /** R1–R4 and R8–R10: complete when there is no selection bias (Zhang 2008, §4). */
    public static PagRules withoutSelectionBias() {
        return new PagRules(EnumSet.complementOf(EnumSet.of(Rule.R5, Rule.R6, Rule.R7)));
    }

    /** Only the rules named (R0 is always available through {@link #orientColliders}). */
    public static PagRules only(Rule... chosen) {
        EnumSet<Rule> kept = EnumSet.noneOf(Rule.class);
        kept.addAll(Arrays.asList(chosen));
        return new PagRules(kept);
    }

    /** The same rules without the ones named (for ablation studies and tests). */
    public PagRules without(Rule... dropped) {
        EnumSet<Rule> kept = EnumSet.noneOf(Rule.class);
        kept.addAll(rules);
        for (Rule r : dropped) {
            kept.remove(r);
        }
        return new PagRules(kept);
    }

    /** The rules applied by {@link #close}. */
    public Set<Rule> rules() {
        return rules;
    }

    /**
     * R0: for every unshielded triple {@code a *-* b *-* c} whose middle vertex {@code info}
     * calls a collider, puts arrowheads at {@code b}. Returns the number of marks changed.
     */
    public int orientColliders(MutableGraph g, SeparationInfo info) {
        Run run = new Run(g, info, () -> { });
        run.r0();
        return run.changes;
    }

    /** Applies the rules to closure; returns the number of marks changed. */
    public int close(MutableGraph g, SeparationInfo info) {
        return close(g, info, () -> { });
    }

    /**
     * As {@link #close(MutableGraph, SeparationInfo)}, calling {@code checkpoint} before every
     * pass over the rules, so that a caller with a deadline can stop a long closure (by
     * throwing from it; the graph is then left part-way oriented).
     */
    public int close(MutableGraph g, SeparationInfo info, Runnable checkpoint) {
        Run run = new Run(g, info, checkpoint);
        run.close();
        return run.changes;
    }

    /** R0, then the rules to closure; returns the number of marks changed. */
    public int orient(MutableGraph g, SeparationInfo info) {
        Run run = new Run(g, info, () -> { });
        run.r0();
        run.close();
        return run.changes;
    }

    private final class Run {
        private final MutableGraph g;
        private final SeparationInfo info;
        private final Runnable checkpoint;
        private final int n;
        // The rules never change adjacencies, so a sorted snapshot of them, with a mirror of
        // the marks kept in step with g, makes adjacency and mark look-ups O(log degree).
        private final int[][] nbr;
        private final Mark[][] marks;
        private final int[] offset;
        private final long[][] adjacency;
        private final int[] stateFrom;
        private final int[] stateSeen;
        private final int[] reachSeen;
        private final int[] stateQueue;
        private int stamp;
        private final boolean[] onPath;
        private final int[] path;
        private int changes;

        Run(MutableGraph g, SeparationInfo info, Runnable checkpoint) {
            this.g = g;
            this.info = info;
            this.checkpoint = checkpoint;
            this.n = g.size();
            this.nbr = new int[n][];
            this.marks = new Mark[n][];
            this.offset = new int[n + 1];
            for (int v = 0; v < n; v++) {
                int[] row = g.neighbours(v);
                Arrays.sort(row);
                nbr[v] = row;
                marks[v] = new Mark[row.length];
                for (int k = 0; k < row.length; k++) {
                    marks[v][k] = g.markAt(v, row[k]);
                }
                offset[v + 1] = offset[v] + row.length;
            }
            // An adjacency bit matrix where it stays small (≤ 2 MB); binary search otherwise.
            this.adjacency = n <= 4096 ? new long[n][(n + 63) >>> 6] : null;
            if (adjacency != null) {
                for (int v = 0; v < n; v++) {
                    for (int w : nbr[v]) {
                        adjacency[v][w >>> 6] |= 1L << w;
                    }
                }
            }
            int states = offset[n];
            this.stateFrom = new int[states];
            for (int v = 0; v < n; v++) {
                Arrays.fill(stateFrom, offset[v], offset[v + 1], v);
            }
            this.stateSeen = new int[states];
            this.stateQueue = new int[states];
            this.reachSeen = new int[n];
            this.onPath = new boolean[n];
            this.path = new int[n];
        }

        private int slot(int v, int w) {
            return Arrays.binarySearch(nbr[v], w);
        }

        private boolean adjacent(int a, int b) {
            if (adjacency != null) {
                return (adjacency[a][b >>> 6] & (1L << b)) != 0;
            }
            return slot(a, b) >= 0;
        }

        private Mark m(int at, int other) {
            int k = slot(at, other);
            return k < 0 ? null : marks[at][k];
        }

        private boolean fits(int at, int other, Mark mark) {
            Mark now = m(at, other);
            return now == Mark.CIRCLE || now == mark;
        }

        private boolean set(int at, int other, Mark mark) {
            int k = slot(at, other);
            if (marks[at][k] == Mark.CIRCLE) {
                marks[at][k] = mark;
                g.setMark(at, other, mark);
                changes++;
                return true;
            }
            return false;
        }

        /** Sets two marks together, only if neither contradicts a mark already there. */
        private boolean set(int at1, int other1, Mark mark1, int at2, int other2, Mark mark2) {
            if (!fits(at1, other1, mark1) || !fits(at2, other2, mark2)) {
                return false;
            }
            boolean a = set(at1, other1, mark1);
            boolean b = set(at2, other2, mark2);
            return a || b;
        }

        private boolean directed(int from, int to) {
            return m(from, to) == Mark.TAIL && m(to, from) == Mark.ARROW;
        }

        /** The edge u *-* v could be directed u → v: no arrow at u, no tail at v. */
        private boolean potentiallyDirected(int u, int v) {
            return m(u, v) != Mark.ARROW && m(v, u) != Mark.TAIL;
        }

        private boolean circleCircle(int u, int v) {
            return m(u, v) == Mark.CIRCLE && m(v, u) == Mark.CIRCLE;
        }

        void close() {
            while (true) {
                boolean changed;
                do {
                    checkpoint.run();
                    changed = false;
                    if (rules.contains(Rule.R1)) {
                        changed |= r1();
                    }
                    if (rules.contains(Rule.R2)) {
                        changed |= r2();
                    }
                    if (rules.contains(Rule.R3)) {
                        changed |= r3();
                    }
                    if (rules.contains(Rule.R4)) {
                        changed |= r4();
                    }
                } while (changed);
                boolean later = false;
                if (rules.contains(Rule.R5)) {
                    later |= r5();
                }
                if (rules.contains(Rule.R6)) {
                    later |= r6();
                }
                if (rules.contains(Rule.R7)) {
                    later |= r7();
                }
                if (rules.contains(Rule.R8)) {
                    later |= r8();
                }
                if (rules.contains(Rule.R9)) {
                    later |= r9();
                }
                if (rules.contains(Rule.R10)) {
                    later |= r10();
                }
                if (!later) {
                    return;
                }
            }
        }

        void r0() {
            for (int b = 0; b < n; b++) {
                int[] nb = nbr[b];
                for (int i = 0; i < nb.length; i++) {
                    for (int j = i + 1; j < nb.length; j++) {
                        int a = nb[i];
                        int c = nb[j];
                        if (!adjacent(a, c) && info.unshieldedCollider(a, b, c)) {
                            set(b, a, Mark.ARROW, b, c, Mark.ARROW);
                        }
                    }
                }
            }
        }

        /** R1: a *→ b o−* c, a and c not adjacent ⇒ b → c. */
        boolean r1() {
            boolean changed = false;
            for (int b = 0; b < n; b++) {
                int[] nb = nbr[b];
                for (int a : nb) {
                    if (m(b, a) != Mark.ARROW) {
                        continue;
                    }
                    for (int c : nb) {
                        if (c != a && m(b, c) == Mark.CIRCLE && !adjacent(a, c)) {
                            changed |= set(b, c, Mark.TAIL, c, b, Mark.ARROW);
                        }
                    }
                }
            }
            return changed;
        }

        /** R2: a → b *→ c or a *→ b → c, and a *−o c ⇒ a *→ c. */
        boolean r2() {
            boolean changed = false;
            for (int c = 0; c < n; c++) {
                int[] nc = nbr[c].clone();
                for (int a : nc) {
                    if (m(c, a) != Mark.CIRCLE) {
                        continue;
                    }
                    for (int b : nc) {
                        if (b == a || m(c, b) != Mark.ARROW || !adjacent(a, b) || m(b, a) != Mark.ARROW) {
                            continue;
                        }
                        if (m(a, b) == Mark.TAIL || m(b, c) == Mark.TAIL) {
                            changed |= set(c, a, Mark.ARROW);
                            break;
                        }
                    }
                }
            }
            return changed;
        }

        /** R3: a *→ b ←* c, a *−o t o−* c, a and c not adjacent, t *−o b ⇒ t *→ b. */
        boolean r3() {
            boolean changed = false;
            for (int b = 0; b < n; b++) {
                int[] nb = nbr[b];
                for (int t : nb) {
                    if (m(b, t) != Mark.CIRCLE) {
                        continue;
                    }
                    found:
                    for (int i = 0; i < nb.length; i++) {
                        int a = nb[i];
                        if (a == t || m(b, a) != Mark.ARROW || !adjacent(a, t) || m(t, a) != Mark.CIRCLE) {
                            continue;
                        }
                        for (int j = i + 1; j < nb.length; j++) {
                            int c = nb[j];
                            if (c == t || m(b, c) != Mark.ARROW || !adjacent(c, t) || m(t, c) != Mark.CIRCLE
                                    || adjacent(a, c)) {
                                continue;
                            }
                            changed |= set(b, t, Mark.ARROW);
                            break found;
                        }
                    }
                }
            }
            return changed;
        }

        /**
         * R4: on a discriminating path {@code <theta, ..., a, b, c>} for {@code b} with
         * {@code b o−* c}: b → c if b is a non-collider, a ↔ b ↔ c if it is a collider.
         */
        boolean r4() {
            boolean changed = false;
            for (int b = 0; b < n; b++) {
                int[] nb = nbr[b];
                for (int c : nb) {
                    if (m(b, c) != Mark.CIRCLE) {
                        continue;
                    }
                    for (int a : nb) {
                        // a is the last collider before b: a ←* b (arrow at a) and a → c.
                        if (a == c || m(a, b) != Mark.ARROW || !adjacent(a, c) || !directed(a, c)) {
                            continue;
                        }
                        int[] path = discriminatingPath(a, b, c);
                        if (path == null) {
                            continue;
                        }
                        if (info.discriminatedCollider(path)) {
                            if (fits(a, b, Mark.ARROW) && fits(b, a, Mark.ARROW) && fits(b, c, Mark.ARROW)
                                    && fits(c, b, Mark.ARROW)) {
                                changed |= set(a, b, Mark.ARROW) | set(b, a, Mark.ARROW)
                                        | set(b, c, Mark.ARROW) | set(c, b, Mark.ARROW);
                            }
                        } else {
                            changed |= set(b, c, Mark.TAIL, c, b, Mark.ARROW);
                        }
                        break;
                    }
                }
            }
            return changed;
        }

        /**
         * A discriminating path {@code <theta, ..., a, b, c>} for {@code b}, from theta to c, or
         * null: a breadth-first search back from {@code a} through vertices that are colliders on
         * the path and parents of {@code c}, stopping at the first vertex not adjacent to
         * {@code c}. Whether a vertex can be extended depends on that vertex only, so visiting
         * each vertex once loses no path; {@code towardA[w]} is the vertex after w on the way
         * back to a, from which the path is read once theta is found.
         */
        private int[] discriminatingPath(int a, int b, int c) {
            boolean[] seen = new boolean[n];
            int[] towardA = new int[n];
            seen[a] = true;
            seen[b] = true;
            seen[c] = true;
            ArrayDeque<Integer> queue = new ArrayDeque<>();
            queue.add(a);
            while (!queue.isEmpty()) {
                int v = queue.poll();
                int[] nv = nbr[v];
                for (int w : nv) {
                    // v must be a collider: the edge from its predecessor w is into v.
                    if (seen[w] || m(v, w) != Mark.ARROW) {
                        continue;
                    }
                    if (!adjacent(w, c)) {
                        towardA[w] = v;
                        return pathFrom(w, towardA, a, b, c);
                    }
                    if (directed(w, c) && m(w, v) == Mark.ARROW) {
                        seen[w] = true;
                        towardA[w] = v;
                        queue.add(w);
                    }
                }
            }
            return null;
        }

        private int[] pathFrom(int theta, int[] towardA, int a, int b, int c) {
            int length = 3;
            for (int v = theta; v != a; v = towardA[v]) {
                length++;
            }
            int[] out = new int[length];
            int k = 0;
            for (int v = theta; v != a; v = towardA[v]) {
                out[k++] = v;
            }
            out[k++] = a;
            out[k++] = b;
            out[k] = c;
            return out;
        }

        /**
         * R5: for a o−o b, if an uncovered circle path {@code <a, c, ..., t, b>} has a, t not
         * adjacent and b, c not adjacent, then a − b and every edge of the path become undirected.
         */
        boolean r5() {
            boolean changed = false;
            for (int a = 0; a < n; a++) {
                for (int b : nbr[a]) {
                    if (!circleCircle(a, b)) {
                        continue;
                    }
                    for (int c : nbr[a]) {
                        if (c == b || !circleCircle(a, c) || adjacent(b, c)) {
                            continue;
                        }
                        int length = uncoveredPath(a, c, b, true, -1, a);
                        if (length > 0) {
                            set(a, b, Mark.TAIL, b, a, Mark.TAIL);
                            for (int i = 0; i + 1 < length; i++) {
                                set(path[i], path[i + 1], Mark.TAIL, path[i + 1], path[i], Mark.TAIL);
                            }
                            changed = true;
                            break;
                        }
                    }
                }
            }
            return changed;
        }

        /** R6: a − b and b o−* c ⇒ b −* c. */
        boolean r6() {
            boolean changed = false;
            for (int b = 0; b < n; b++) {
                int[] nb = nbr[b];
                for (int a : nb) {
                    if (m(a, b) != Mark.TAIL || m(b, a) != Mark.TAIL) {
                        continue;
                    }
                    for (int c : nb) {
                        if (c != a && m(b, c) == Mark.CIRCLE) {
                            changed |= set(b, c, Mark.TAIL);
                        }
                    }
                }
            }
            return changed;
        }

        /** R7: a −o b o−* c, a and c not adjacent ⇒ b −* c. */
        boolean r7() {
            boolean changed = false;
            for (int b = 0; b < n; b++) {
                int[] nb = nbr[b];
                for (int a : nb) {
                    if (m(a, b) != Mark.TAIL || m(b, a) != Mark.CIRCLE) {
                        continue;
                    }
                    for (int c : nb) {
                        if (c != a && m(b, c) == Mark.CIRCLE && !adjacent(a, c)) {
                            changed |= set(b, c, Mark.TAIL);
                        }
                    }
                }
            }
            return changed;
        }

        private boolean circleArrow(int a, int c) {
            return m(a, c) == Mark.CIRCLE && m(c, a) == Mark.ARROW;
        }

        /** R8: a → b → c or a −o b → c, and a o→ c ⇒ a → c. */
        boolean r8() {
            boolean changed = false;
            for (int a = 0; a < n; a++) {
                int[] na = nbr[a];
                for (int c : na) {
                    if (!circleArrow(a, c)) {
                        continue;
                    }
                    for (int b : na) {
                        if (b != c && m(a, b) == Mark.TAIL && m(b, a) != Mark.TAIL && adjacent(b, c)
                                && directed(b, c)) {
                            changed |= set(a, c, Mark.TAIL);
                            break;
                        }
                    }
                }
            }
            return changed;
        }

        /** R9: a o→ c with an uncovered potentially directed path {@code <a, b, ..., c>}, b and c not adjacent ⇒ a → c. */
        boolean r9() {
            boolean changed = false;
            for (int a = 0; a < n; a++) {
                int[] na = nbr[a];
                for (int c : na) {
                    if (!circleArrow(a, c)) {
                        continue;
                    }
                    for (int b : na) {
                        if (b != c && !adjacent(b, c) && potentiallyDirected(a, b)
                                && uncoveredPath(a, b, c, false, -1, -1) > 0) {
                            changed |= set(a, c, Mark.TAIL);
                            break;
                        }
                    }
                }
            }
            return changed;
        }

        /**
         * R10: a o→ c, b → c ← t, uncovered potentially directed paths from a to b and from a
         * to t whose vertices after a, m and w, are distinct and not adjacent ⇒ a → c. The
         * paths avoid c.
         */
        boolean r10() {
            boolean changed = false;
            for (int a = 0; a < n; a++) {
                int[] na = nbr[a];
                for (int c : na) {
                    if (!circleArrow(a, c)) {
                        continue;
                    }
                    int[] nc = nbr[c].clone();
                    int parents = 0;
                    for (int p : nc) {
                        if (directed(p, c)) {
                            nc[parents++] = p;
                        }
                    }
                    if (parents < 2) {
                        continue;
                    }
                    // For each first step m from a, which parents of c it leads to (−1 none, −2 several).
                    int[] firsts = new int[na.length];
                    int[] reached = new int[na.length];
                    int count = 0;
                    for (int first : na) {
                        if (first == c || !potentiallyDirected(a, first)) {
                            continue;
                        }
                        int found = -1;
                        walk(a, first, false, c);
                        for (int i = 0; i < parents && found != -2; i++) {
                            int p = nc[i];
                            if (p == first || (reachSeen[p] == stamp && exactPath(a, first, p, false, c, -1) > 0)) {
                                found = found == -1 ? p : -2;
                            }
                        }
                        if (found != -1) {
                            firsts[count] = first;
                            reached[count++] = found;
                        }
                    }
                    found:
                    for (int i = 0; i < count; i++) {
                        for (int j = i + 1; j < count; j++) {
                            if (!adjacent(firsts[i], firsts[j])
                                    && (reached[i] == -2 || reached[j] == -2 || reached[i] != reached[j])) {
                                changed |= set(a, c, Mark.TAIL);
                                break found;
                            }
                        }
                    }
                }
            }
            return changed;
        }

        /**
         * Searches for an uncovered path {@code <start, second, ..., target>} (every three
         * consecutive vertices unshielded) whose edges are all circle–circle ({@code circles})
         * or all potentially directed away from {@code start}, avoiding {@code avoid}; when
         * {@code notAdjacentToLast} ≥ 0 the vertex before {@code target} must not be adjacent
         * to it. Returns the number of vertices on the path found, left in {@link #path}, or
         * 0. The edge start–second is assumed checked by the caller.
         */
        private int uncoveredPath(int start, int second, int target, boolean circles, int avoid,
                                  int notAdjacentToLast) {
            if (second == target || second == avoid) {
                return 0;
            }
            walk(start, second, circles, avoid);
            return reachSeen[target] == stamp ? exactPath(start, second, target, circles, avoid, notAdjacentToLast) : 0;
        }

        /** The depth-first search of {@link #uncoveredPath}, without the walk filter. */
        private int exactPath(int start, int second, int target, boolean circles, int avoid,
                              int notAdjacentToLast) {
            onPath[start] = true;
            onPath[second] = true;
            path[0] = start;
            path[1] = second;
            int length = extend(2, target, circles, avoid, notAdjacentToLast);
            // extend() clears its own marks on failure; on success the path found is cleared here.
            for (int i = 0; i < Math.max(length, 2); i++) {
                onPath[path[i]] = false;
            }
            return length;
        }

        private int extend(int depth, int target, boolean circles, int avoid, int notAdjacentToLast) {
            int prev = path[depth - 2];
            int cur = path[depth - 1];
            for (int next : nbr[cur]) {
                if (onPath[next] || next == avoid || adjacent(prev, next)) {
                    continue;
                }
                if (circles ? !circleCircle(cur, next) : !potentiallyDirected(cur, next)) {
                    continue;
                }
                if (next == target) {
                    if (notAdjacentToLast >= 0 && adjacent(cur, notAdjacentToLast)) {
                        continue;
                    }
                    path[depth] = next;
                    return depth + 1;
                }
                onPath[next] = true;
                path[depth] = next;
                int length = extend(depth + 1, target, circles, avoid, notAdjacentToLast);
                if (length > 0) {
                    return length;
                }
                onPath[next] = false;
            }
            return 0;
        }

        /**
         * A necessary condition for {@link #uncoveredPath}: marks (with the current {@link
         * #stamp} in {@link #reachSeen}) every vertex that ends a walk {@code <start, second,
         * ...>} obeying the same local conditions, repeated vertices allowed. A breadth-first
         * search over directed edge states, O(Σ deg(v)²).
         */
        private void walk(int start, int second, boolean circles, int avoid) {
            stamp++;
            reachSeen[second] = stamp;
            int head = 0;
            int tail = 0;
            int first = offset[start] + slot(start, second);
            stateSeen[first] = stamp;
            stateQueue[tail++] = first;
            while (head < tail) {
                int s = stateQueue[head++];
                int prev = stateFrom[s];
                int cur = nbr[prev][s - offset[prev]];
                int[] row = nbr[cur];
                for (int k = 0; k < row.length; k++) {
                    int next = row[k];
                    if (next == prev || next == start || next == avoid || adjacent(prev, next)) {
                        continue;
                    }
                    if (circles ? !circleCircle(cur, next) : !potentiallyDirected(cur, next)) {
                        continue;
                    }
                    reachSeen[next] = stamp;
                    int t = offset[cur] + k;
                    if (stateSeen[t] != stamp) {
                        stateSeen[t] = stamp;
                        stateQueue[tail++] = t;
                    }
                }
            }
        }
    }
}

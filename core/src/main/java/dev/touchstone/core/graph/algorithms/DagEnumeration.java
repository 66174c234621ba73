package dev.touchstone.core.graph.algorithms;

import dev.touchstone.core.graph.Graph;
import dev.touchstone.core.graph.MutableGraph;

import java.util.ArrayList;
import java.util.Collections;
import java.util.List;
import java.util.function.Consumer;

/**
 * Every labelled DAG on a few variables, for exhaustive tests: each unordered pair of
 * variables is absent, i → j or j → i, and each of the 3^(n(n−1)/2) assignments that is
 * acyclic is one DAG. Counts are OEIS A003024 (Robinson 1973): 1, 3, 25, 543, 29281,
 * 3781503 for n = 1 … 6.
 *
 * <p>Acyclicity is tested on bit masks of parents (peel off a variable with no remaining
 * parent until none is left), O(n²) word operations per assignment: n = 5 takes a few
 * milliseconds plus the cost of building 29281 {@link Graph}s; {@link #count} for n = 6
 * builds no graphs.
 */
public final class DagEnumeration {

    /** The largest n for which graphs are built (29281 DAGs); {@link #count} goes to 6. */
    public static final int MAX_BUILT = 5;
    /** The largest n {@link #count} accepts (3^15 assignments). */
    public static final int MAX_COUNTED = 6;

    private DagEnumeration() {
    }

    /** The names {@code x1 … xn} used by {@link #all(int)}. */
    public static List<String> defaultNames(int n) {
        List<String> names = new ArrayList<>(n);
        for (int i = 1; i <= n; i++) {
            names.add("x" + i);
        }
        return names;
    }

    /** All labelled DAGs over {@code x1 … xn}, in a fixed order. */
    public static List<Graph> all(int n) {
        return all(defaultNames(n));
    }

    /** All labelled DAGs over these variables (at most {@value #MAX_BUILT}), in a fixed order. */
    public static List<Graph> all(List<String> names) {
        List<Graph> out = new ArrayList<>();
        forEach(names, out::add);
        return Collections.unmodifiableList(out);
    }

    /** Hands every labelled DAG over these variables (at most {@value #MAX_BUILT}) to {@code visitor}. */
    public static void forEach(List<String> names, Consumer<Graph> visitor) {
        int n = names.size();
        if (n < 1 || n > MAX_BUILT) {
            throw new IllegalArgumentException("DAGs are enumerated for 1 to " + MAX_BUILT + " variables, not " + n);
        }
        enumerate(n, parents -> {
            MutableGraph g = Graph.builder(names);
            for (int c = 0; c < n; c++) {
                for (int p = 0; p < n; p++) {
                    if ((parents[c] >>> p & 1) != 0) {
                        g.addDirected(p, c);
                    }
                }
            }
            visitor.accept(g.freeze());
        });
    }

    /** The number of labelled DAGs on {@code n} variables (1 ≤ n ≤ {@value #MAX_COUNTED}), by enumeration. */
    public static long count(int n) {
        if (n < 1 || n > MAX_COUNTED) {
            throw new IllegalArgumentException("DAGs are counted for 1 to " + MAX_COUNTED + " variables, not " + n);
        }
        long[] count = new long[1];
        enumerate(n, parents -> count[0]++);
        return count[0];
    }

    /** Calls {@code sink} with the parent masks of every acyclic assignment (the array is reused). */
    private static void enumerate(int n, Consumer<int[]> sink) {
        int pairs = n * (n - 1) / 2;
        int[] lo = new int[pairs];
        int[] hi = new int[pairs];
        for (int i = 0, k = 0; i < n; i++) {
            for (int j = i + 1; j < n; j++, k++) {
                lo[k] = i;
                hi[k] = j;
            }
        }
        int[] digit = new int[pairs];
        int[] parents = new int[n];
        while (true) {
            if (isAcyclic(parents, n)) {
                sink.accept(parents);
            }
            // Advance the base-3 counter, keeping the parent masks in step.
            int k = 0;
            while (k < pairs && digit[k] == 2) {
                digit[k] = 0;
                parents[lo[k]] &= ~(1 << hi[k]);
                k++;
            }
            if (k == pairs) {
                return;
            }
            if (digit[k] == 0) {
                digit[k] = 1; // lo → hi
                parents[hi[k]] |= 1 << lo[k];
            } else {
                digit[k] = 2; // hi → lo
                parents[hi[k]] &= ~(1 << lo[k]);
                parents[lo[k]] |= 1 << hi[k];
            }
        }
    }

    private static boolean isAcyclic(int[] parents, int n) {
        int remaining = (1 << n) - 1;
        while (remaining != 0) {
            int next = -1;
            for (int v = 0; v < n; v++) {
                if ((remaining >>> v & 1) != 0 && (parents[v] & remaining) == 0) {
                    next = v;
                    break;
                }
            }
            if (next < 0) {
                return false;
            }
            remaining &= ~(1 << next);
        }
        return true;
    }
}

package dev.touchstone.learners.hybrid;

import dev.touchstone.core.learner.RunContext;
import dev.touchstone.learners.independence.IndependenceTest;

import java.util.ArrayList;
import java.util.List;
import java.util.function.Predicate;

/**
 * Max-Min Parents and Children (Tsamardinos, Aliferis and Statnikov 2003, KDD; as used in MMHC,
 * Tsamardinos, Brown and Aliferis 2006, "The max-min hill-climbing Bayesian network structure
 * learning algorithm", Machine Learning 65, §3; from memory): the candidate parents and children
 * of each target, then the skeleton from the symmetry correction.
 *
 * <p>For a target t, the forward phase keeps, for every variable x, its minimum association with
 * t over the subsets S of the current candidate set, and adds the variable whose minimum is
 * largest (the max-min heuristic) until every remaining variable has a subset given which it is
 * independent of t; a variable found independent is dropped for good, since the candidate set
 * only grows and its minimum can only fall. The backward phase removes each candidate x
 * independent of t given some subset of the other candidates. Association is −ln p of the test
 * (0 when the test accepts independence; common practice for the p-value based association
 * measures of the paper), so the oracle's dependences all tie and are taken in variable order.
 *
 * <p>Symmetry correction: without it a child's spouse can enter the children of a target
 * (Tsamardinos et al. 2006, §3, from memory); the paper keeps x − y only when each is in the
 * other's set ({@code and}); {@code or} keeps x − y when either is.
 *
 * <p>Cost: O(p · |CPC| · 2^|CPC|) tests per target, bounded by {@code maxDepth}; the deadline
 * is checked before every test batch. Not thread-safe.
 */
final class Mmpc {

    private final IndependenceTest test;
    private final int maxDepth;
    private final RunContext context;
    private long tests;

    /** @param maxDepth the largest conditioning set, −1 for no limit */
    Mmpc(IndependenceTest test, int maxDepth, RunContext context) {
        this.test = test;
        this.maxDepth = maxDepth < 0 ? Integer.MAX_VALUE : maxDepth;
        this.context = context;
    }

    long tests() {
        return tests;
    }

    /** Whether x − y is in the skeleton of the candidate sets {@code pc}, by the rule chosen. */
    static boolean joined(List<int[]> pc, int x, int y, boolean both) {
        boolean xy = contains(pc.get(x), y);
        boolean yx = contains(pc.get(y), x);
        return both ? xy && yx : xy || yx;
    }

    /** The candidate parents and children of every variable, before the symmetry correction. */
    List<int[]> all() {
        List<int[]> out = new ArrayList<>();
        for (int t = 0; t < test.variables(); t++) {
            out.add(of(t));
        }
        return out;
    }

    /** The candidate parents and children of {@code t}, ascending. */
    int[] of(int t) {
        int p = test.variables();
        double[] min = new double[p];
        boolean[] alive = new boolean[p];
        for (int x = 0; x < p; x++) {
            if (x != t) {
                context.checkDeadline();
                min[x] = association(x, t, new int[0]);
                alive[x] = min[x] > 0;
            }
        }
        List<Integer> cpc = new ArrayList<>();
        while (true) {
            int f = -1;
            for (int x = 0; x < p; x++) {
                if (alive[x] && (f < 0 || min[x] > min[f])) {
                    f = x;
                }
            }
            if (f < 0) {
                break;
            }
            alive[f] = false;
            int[] before = toArray(cpc);
            cpc.add(f);
            for (int x = 0; x < p; x++) {
                if (!alive[x]) {
                    continue;
                }
                context.checkDeadline();
                final int candidate = x;
                final int added = f;
                // Only the subsets with f are new; the others were taken into min[x] already.
                subsets(before, Math.min(before.length, maxDepth - 1), s -> {
                    int[] z = with(s, added);
                    double a = association(candidate, t, z);
                    min[candidate] = Math.min(min[candidate], a);
                    return a > 0;
                });
                alive[x] = min[x] > 0;
            }
        }
        // Backward phase: drop candidates some subset of the others separates from t.
        for (int i = 0; i < cpc.size(); ) {
            context.checkDeadline();
            int x = cpc.get(i);
            List<Integer> others = new ArrayList<>(cpc);
            others.remove(i);
            int[] rest = toArray(others);
            boolean[] separated = {false};
            subsets(rest, Math.min(rest.length, maxDepth), s -> {
                tests++;
                separated[0] = test.independent(x, t, s);
                return !separated[0];
            });
            if (separated[0]) {
                cpc.remove(i);
            } else {
                i++;
            }
        }
        int[] out = toArray(cpc);
        java.util.Arrays.sort(out);
        return out;
    }

    private double association(int x, int t, int[] z) {
        tests++;
        double pv = test.pValue(x, t, z);
        return pv > test.alpha() ? 0 : -Math.log(Math.max(pv, Double.MIN_VALUE));
    }

    /**
     * Calls {@code visitor} with every subset of {@code set} of size 0 … {@code largest}, by size
     * then in lexicographic order of positions, until it returns false.
     */
    private static void subsets(int[] set, int largest, Predicate<int[]> visitor) {
        for (int size = 0; size <= largest; size++) {
            int[] c = new int[size];
            for (int i = 0; i < size; i++) {
                c[i] = i;
            }
            while (true) {
                int[] z = new int[size];
                for (int i = 0; i < size; i++) {
                    z[i] = set[c[i]];
                }
                if (!visitor.test(z)) {
                    return;
                }
                int i = size - 1;
                while (i >= 0 && c[i] == set.length - size + i) {
                    i--;
                }
                if (i < 0) {
                    break;
                }
                c[i]++;
                for (int j = i + 1; j < size; j++) {
                    c[j] = c[j - 1] + 1;
                }
            }
        }
    }

    private static int[] with(int[] s, int v) {
        int[] z = java.util.Arrays.copyOf(s, s.length + 1);
        z[s.length] = v;
        return z;
    }

    private static int[] toArray(List<Integer> list) {
        int[] out = new int[list.size()];
        for (int i = 0; i < out.length; i++) {
            out[i] = list.get(i);
        }
        return out;
    }

    private static boolean contains(int[] sorted, int v) {
        return java.util.Arrays.binarySearch(sorted, v) >= 0;
    }
}

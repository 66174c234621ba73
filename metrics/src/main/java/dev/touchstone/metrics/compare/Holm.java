package dev.touchstone.metrics.compare;

import java.util.Arrays;
import java.util.Comparator;

/**
 * The step-down multiple-test adjustment of Holm (1979, "A simple sequentially rejective multiple
 * test procedure", Scandinavian Journal of Statistics 6): with the m p-values sorted ascending,
 * the i-th (1-based) becomes max over j ≤ i of min(1, (m − j + 1)·p_(j)). It controls the
 * family-wise error rate without assumptions on dependence. Cost O(m log m).
 */
public final class Holm {

    private Holm() {
    }

    /**
     * Adjusted p-values in the order given. Null entries (tests that could not be computed) stay
     * null and do not count in m.
     */
    public static Double[] adjust(Double[] p) {
        Integer[] order = new Integer[p.length];
        int m = 0;
        for (int i = 0; i < p.length; i++) {
            if (p[i] != null) {
                if (!(p[i] >= 0 && p[i] <= 1)) {
                    throw new IllegalArgumentException("a p-value must be in [0, 1], got " + p[i]);
                }
                order[m++] = i;
            }
        }
        Integer[] present = Arrays.copyOf(order, m);
        Arrays.sort(present, Comparator.comparingDouble(i -> p[i]));
        Double[] out = new Double[p.length];
        double running = 0;
        for (int k = 0; k < m; k++) {
            double adjusted = Math.min(1.0, (m - k) * p[present[k]]);
            running = Math.max(running, adjusted);
            out[present[k]] = running;
        }
        return out;
    }
}

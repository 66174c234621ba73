package dev.touchstone.reports.charts;

import org.junit.jupiter.api.Test;

import java.awt.geom.Rectangle2D;
import java.util.ArrayList;
import java.util.List;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

class CriticalDifferenceDiagramTest {

    private static List<int[]> permutations(int k) {
        List<int[]> out = new ArrayList<>();
        permute(new int[k], new boolean[k], 0, out);
        return out;
    }

    private static void permute(int[] cur, boolean[] used, int pos, List<int[]> out) {
        if (pos == cur.length) {
            out.add(cur.clone());
            return;
        }
        for (int r = 0; r < cur.length; r++) {
            if (!used[r]) {
                used[r] = true;
                cur[pos] = r + 1;
                permute(cur, used, pos + 1, out);
                used[r] = false;
            }
        }
    }

    /**
     * The smallest exact p-value of Friedman's statistic over N settings and k configurations,
     * by enumerating all (k!)^N equally likely rankings under the null hypothesis (Friedman 1937):
     * the share of outcomes whose statistic sum_j R_j^2 reaches the largest possible value.
     */
    private static double smallestExactP(int k, int n) {
        List<int[]> perms = permutations(k);
        int outcomes = (int) Math.pow(perms.size(), n);
        double[] stat = new double[outcomes];
        double max = 0;
        for (int o = 0; o < outcomes; o++) {
            int[] sums = new int[k];
            int code = o;
            for (int b = 0; b < n; b++) {
                int[] p = perms.get(code % perms.size());
                code /= perms.size();
                for (int j = 0; j < k; j++) {
                    sums[j] += p[j];
                }
            }
            double s = 0;
            for (int v : sums) {
                s += (double) v * v;
            }
            stat[o] = s;
            max = Math.max(max, s);
        }
        int extreme = 0;
        for (double s : stat) {
            extreme += s >= max - 1e-9 ? 1 : 0;
        }
        return (double) extreme / outcomes;
    }

    @Test
    void minimumSettingsAgreeWithTheExactFriedmanDistribution() {
        for (int k = 2; k <= 3; k++) {
            int needed = CriticalDifferenceDiagram.minimumSettings(k, 0.05);
            assertTrue(smallestExactP(k, needed) <= 0.05, "k=" + k + ": N=" + needed + " can reach 0.05");
            if (needed > 2) {
                assertTrue(smallestExactP(k, needed - 1) > 0.05, "k=" + k + ": N=" + (needed - 1) + " cannot");
            }
        }
        // worked by hand: k = 2 gives (1/2)^5 = 0.031 at N = 6 but 0.0625 at N = 5; k = 3 gives 1/36 at N = 3
        assertEquals(6, CriticalDifferenceDiagram.minimumSettings(2, 0.05));
        assertEquals(3, CriticalDifferenceDiagram.minimumSettings(3, 0.05));
        assertEquals(2, CriticalDifferenceDiagram.minimumSettings(5, 0.05));
    }

    @Test
    void noLabelOverlapsAnotherOrIsStruckByABar() {
        // Twenty configurations with close ranks and a wide critical difference: the crowded case.
        List<CriticalDifferenceDiagram.Entry> entries = new ArrayList<>();
        for (int i = 0; i < 20; i++) {
            entries.add(new CriticalDifferenceDiagram.Entry("pc alpha=0.0" + (i % 9 + 1) + " test " + i,
                    1 + i * 0.9 + (i % 3) * 0.05));
        }
        for (double cd : new double[] {0.8, 4.5, 19.0}) {
            for (int width : new int[] {530, 1000}) {
                List<CriticalDifferenceDiagram.Placed> placed =
                        new CriticalDifferenceDiagram("Structural Hamming distance: mean ranks", entries, cd).placed(width);
                List<Rectangle2D> texts = new ArrayList<>();
                List<Rectangle2D> bars = new ArrayList<>();
                Rectangle2D frame = null;
                for (CriticalDifferenceDiagram.Placed p : placed) {
                    if (p.kind().equals("frame")) {
                        frame = p.box();
                    } else {
                        (p.kind().equals("text") ? texts : bars).add(p.box());
                    }
                }
                long labels = placed.stream().filter(p -> p.kind().equals("text") && p.content().contains(" test ")).count();
                assertEquals(20, labels, "every configuration is labelled");
                assertTrue(placed.stream().anyMatch(p -> p.content().startsWith("CD = ")), "the CD value is written");
                for (int i = 0; i < texts.size(); i++) {
                    Rectangle2D a = texts.get(i);
                    assertTrue(frame.contains(a), "text inside the picture: " + a + " in " + frame);
                    for (int j = i + 1; j < texts.size(); j++) {
                        assertFalse(a.intersects(texts.get(j)), "texts overlap: " + a + " and " + texts.get(j));
                    }
                    for (Rectangle2D b : bars) {
                        assertFalse(a.intersects(b), "a bar crosses a text: " + b + " and " + a);
                    }
                }
            }
        }
    }
}

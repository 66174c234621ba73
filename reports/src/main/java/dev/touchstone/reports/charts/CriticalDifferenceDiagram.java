package dev.touchstone.reports.charts;

import org.jfree.svg.SVGGraphics2D;

import java.awt.BasicStroke;
import java.awt.Color;
import java.awt.Font;
import java.awt.FontMetrics;
import java.awt.geom.Line2D;
import java.util.ArrayList;
import java.util.Comparator;
import java.util.List;
import java.util.Locale;

/**
 * The critical difference diagram of Demšar (2006, "Statistical comparisons of classifiers
 * over multiple data sets", JMLR 7, Fig. 1): learners placed on an axis of mean rank
 * (1 = best, at the left), the Nemenyi critical difference drawn as a bar, and thick
 * lines joining groups of learners whose mean ranks differ by less than it.
 */
public final class CriticalDifferenceDiagram {

    /** A learner configuration and its mean rank over settings. */
    public record Entry(String name, double meanRank) {
    }

    private final String title;
    private final List<Entry> entries;
    private final double criticalDifference;

    public CriticalDifferenceDiagram(String title, List<Entry> entries, double criticalDifference) {
        this.title = title;
        List<Entry> sorted = new ArrayList<>(entries);
        sorted.sort(Comparator.comparingDouble(Entry::meanRank).thenComparing(Entry::name));
        this.entries = List.copyOf(sorted);
        this.criticalDifference = criticalDifference;
    }

    /**
     * The fewest settings (blocks) N for which Friedman's test of k configurations can reach
     * significance at {@code alpha} at all: under the null hypothesis each setting ranks the k
     * configurations in one of k! equally likely orders, independently, so the most extreme
     * outcome (every setting ranking alike, the largest statistic) has exact probability
     * k!·(1/k!)^N = (k!)^-(N-1) (Friedman 1937, JASA 32, the permutation distribution of the
     * statistic without ties); below that N no outcome can be significant. At least 2.
     */
    public static int minimumSettings(int k, double alpha) {
        if (k < 2) {
            throw new IllegalArgumentException("ranking needs at least two configurations, got " + k);
        }
        double logFactorial = 0;
        for (int i = 2; i <= k; i++) {
            logFactorial += Math.log(i);
        }
        // smallest N with -(N-1) log k! <= log alpha
        int n = 1 + (int) Math.ceil(-Math.log(alpha) / logFactorial - 1e-12);
        return Math.max(2, n);
    }

    /**
     * The groups to join: maximal runs of learners (in rank order) whose mean ranks span
     * less than the critical difference, leaving out runs contained in a longer one.
     * Each group is given as [first, last] positions in rank order.
     */
    public List<int[]> groups() {
        List<int[]> out = new ArrayList<>();
        int k = entries.size();
        int lastEnd = -1;
        for (int i = 0; i < k; i++) {
            int j = i;
            while (j + 1 < k && entries.get(j + 1).meanRank() - entries.get(i).meanRank() < criticalDifference) {
                j++;
            }
            if (j > i && j > lastEnd) {
                out.add(new int[] {i, j});
                lastEnd = j;
            }
        }
        return out;
    }

    /** The diagram as an {@code <svg>} element. */
    public String toSvg(int width) {
        int k = entries.size();
        int half = (k + 1) / 2;
        int rowHeight = 18;
        int axisY = 70;
        List<int[]> groups = groups();
        int rowsTop = axisY + 22 + groups.size() * 6;
        int height = rowsTop + Math.max(half, k - half) * rowHeight + 20;
        SVGGraphics2D g = Svg.canvas(width, height);
        g.setColor(Color.WHITE);
        g.fillRect(0, 0, width, height);
        Font font = new Font("SansSerif", Font.PLAIN, 11);
        g.setFont(new Font("SansSerif", Font.BOLD, 13));
        g.setColor(Color.BLACK);
        g.drawString(title, 10, 18);
        g.setFont(font);
        FontMetrics fm = g.getFontMetrics();
        int labelWidth = 0;
        for (Entry e : entries) {
            labelWidth = Math.max(labelWidth, fm.stringWidth(label(e)));
        }
        double left = Math.min(width / 3.0, labelWidth + 30);
        double right = width - left;
        int maxRank = Math.max(k, 2);
        java.util.function.DoubleUnaryOperator xOf = r -> left + (r - 1) / (maxRank - 1) * (right - left);

        g.setStroke(new BasicStroke(1f));
        g.draw(new Line2D.Double(left, axisY, right, axisY));
        for (int r = 1; r <= maxRank; r++) {
            double x = xOf.applyAsDouble(r);
            g.draw(new Line2D.Double(x, axisY, x, axisY - 5));
            String t = Integer.toString(r);
            g.drawString(t, (float) (x - fm.stringWidth(t) / 2.0), axisY - 8);
        }
        g.drawString("mean rank (1 = best)", (float) left, axisY - 24);
        if (criticalDifference > 0 && !Double.isNaN(criticalDifference)) {
            double x0 = xOf.applyAsDouble(1);
            double x1 = xOf.applyAsDouble(Math.min(1 + criticalDifference, maxRank));
            g.setStroke(new BasicStroke(2f));
            g.draw(new Line2D.Double(x0, 40, x1, 40));
            g.draw(new Line2D.Double(x0, 36, x0, 44));
            g.draw(new Line2D.Double(x1, 36, x1, 44));
            String cd = String.format(Locale.ROOT, "CD = %.2f", criticalDifference);
            g.drawString(cd, (float) (x1 + 6), 44);
        }
        g.setStroke(new BasicStroke(1f));
        for (int i = 0; i < k; i++) {
            Entry e = entries.get(i);
            double x = xOf.applyAsDouble(e.meanRank());
            boolean onLeft = i < half;
            int row = onLeft ? i : k - 1 - i;
            double y = rowsTop + row * rowHeight;
            g.setColor(Color.BLACK);
            g.draw(new Line2D.Double(x, axisY, x, y));
            String text = label(e);
            if (onLeft) {
                g.draw(new Line2D.Double(left - 10, y, x, y));
                g.drawString(text, (float) (left - 14 - fm.stringWidth(text)), (float) (y + 4));
            } else {
                g.draw(new Line2D.Double(x, y, right + 10, y));
                g.drawString(text, (float) (right + 14), (float) (y + 4));
            }
        }
        g.setStroke(new BasicStroke(4f, BasicStroke.CAP_ROUND, BasicStroke.JOIN_ROUND));
        int level = 0;
        for (int[] grp : groups) {
            double y = axisY + 10 + level * 6;
            g.draw(new Line2D.Double(xOf.applyAsDouble(entries.get(grp[0]).meanRank()) - 3, y,
                    xOf.applyAsDouble(entries.get(grp[1]).meanRank()) + 3, y));
            level++;
        }
        return g.getSVGElement();
    }

    private static String label(Entry e) {
        return String.format(Locale.ROOT, "%s (%.2f)", e.name(), e.meanRank());
    }
}

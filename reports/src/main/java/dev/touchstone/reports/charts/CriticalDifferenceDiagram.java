package dev.touchstone.reports.charts;

import java.awt.BasicStroke;
import java.awt.Color;
import java.awt.Font;
import java.awt.FontMetrics;
import java.awt.Graphics2D;
import java.awt.geom.Line2D;
import java.awt.geom.Rectangle2D;
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

    // Top to bottom: title; critical-difference bar with its value; axis label; tick numbers and axis;
    // group bars; label rows; each in its own band so that no bar crosses a text.
    private static final int CD_Y = 36;
    private static final int AXIS_Y = 76;
    private static final int ROW_HEIGHT = 18;
    private static final Font FONT = new Font("SansSerif", Font.PLAIN, 11);

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

    /** Something drawn: a text ({@code text}) or a horizontal bar ({@code bar}) and its bounding box. */
    public record Placed(String kind, String content, Rectangle2D box) {
    }

    /** The diagram as an {@code <svg>} element. */
    public String toSvg(int width) {
        return figure(width).toSvg();
    }

    /**
     * The diagram as a figure (for SVG and PDF), at least {@code width} wide: long labels widen
     * the picture (it scales down on the page) rather than running off its edge.
     */
    public Figure figure(int width) {
        int labelWidth = labelWidth();
        int wide = Math.max(width, 2 * (labelWidth + 30) + 160);
        return new Figure(wide, height(), g -> draw(g, labelWidth, wide, new ArrayList<>()));
    }

    /** The texts and horizontal bars of the diagram at this width with their bounding boxes (for overlap checks). */
    public List<Placed> placed(int width) {
        Figure f = figure(width);
        List<Placed> out = new ArrayList<>();
        draw(Svg.canvas(f.width(), f.height()), labelWidth(), f.width(), out);
        return out;
    }

    private int labelWidth() {
        FontMetrics fm = Svg.metrics(FONT);
        int labelWidth = 0;
        for (Entry e : entries) {
            labelWidth = Math.max(labelWidth, fm.stringWidth(label(e)));
        }
        return labelWidth;
    }

    private int rowsTop() {
        return AXIS_Y + 22 + groups().size() * 6;
    }

    private int height() {
        int k = entries.size();
        int half = (k + 1) / 2;
        return rowsTop() + Math.max(half, k - half) * ROW_HEIGHT + 12;
    }

    private void draw(Graphics2D g, int labelWidth, int width, List<Placed> placed) {
        int k = entries.size();
        int half = (k + 1) / 2;
        List<int[]> groups = groups();
        int rowsTop = rowsTop();
        int height = height();
        FontMetrics fm = Svg.metrics(FONT);
        placed.add(new Placed("frame", "", new Rectangle2D.Double(0, 0, width, height)));
        g.setColor(Color.WHITE);
        g.fillRect(0, 0, width, height);
        g.setFont(new Font("SansSerif", Font.BOLD, 13));
        g.setColor(Color.BLACK);
        text(g, placed, title, 10, 18);
        g.setFont(FONT);
        double left = labelWidth + 30;
        double right = width - left;
        int maxRank = Math.max(k, 2);
        java.util.function.DoubleUnaryOperator xOf = r -> left + (r - 1) / (maxRank - 1) * (right - left);

        g.setStroke(new BasicStroke(1f));
        g.draw(new Line2D.Double(left, AXIS_Y, right, AXIS_Y));
        // Number every rank while the numbers fit, else every 2nd, 5th or 10th (ticks stay on every rank).
        double spacing = (right - left) / (maxRank - 1);
        int every = 1;
        for (int step : new int[] {1, 2, 5, 10, 20, 50}) {
            every = step;
            if (step * spacing >= fm.stringWidth(Integer.toString(maxRank)) + 6) {
                break;
            }
        }
        for (int r = 1; r <= maxRank; r++) {
            double x = xOf.applyAsDouble(r);
            g.draw(new Line2D.Double(x, AXIS_Y, x, AXIS_Y - 5));
            if (r == 1 || r % every == 0) {
                String t = Integer.toString(r);
                text(g, placed, t, (float) (x - fm.stringWidth(t) / 2.0), AXIS_Y - 8);
            }
        }
        String axisLabel = "mean rank (1 = best)";
        text(g, placed, axisLabel, (float) ((left + right) / 2 - fm.stringWidth(axisLabel) / 2.0), AXIS_Y - 22);
        if (criticalDifference > 0 && !Double.isNaN(criticalDifference)) {
            double x0 = xOf.applyAsDouble(1);
            double x1 = xOf.applyAsDouble(Math.min(1 + criticalDifference, maxRank));
            g.setStroke(new BasicStroke(2f));
            g.draw(new Line2D.Double(x0, CD_Y, x1, CD_Y));
            g.draw(new Line2D.Double(x0, CD_Y - 4, x0, CD_Y + 4));
            g.draw(new Line2D.Double(x1, CD_Y - 4, x1, CD_Y + 4));
            placed.add(new Placed("bar", "critical difference", new Rectangle2D.Double(x0, CD_Y - 4, x1 - x0, 8)));
            String cd = String.format(Locale.ROOT, "CD = %.2f", criticalDifference);
            double cx = x1 + 6 + fm.stringWidth(cd) <= width ? x1 + 6 : x0 - 6 - fm.stringWidth(cd);
            if (cx < 0) {
                cx = x0;
            }
            text(g, placed, cd, (float) cx, cx == x0 ? CD_Y - 8 : CD_Y + 4);
        }
        g.setStroke(new BasicStroke(1f));
        for (int i = 0; i < k; i++) {
            Entry e = entries.get(i);
            double x = xOf.applyAsDouble(e.meanRank());
            boolean onLeft = i < half;
            int row = onLeft ? i : k - 1 - i;
            double y = rowsTop + row * ROW_HEIGHT;
            g.setColor(Color.BLACK);
            g.draw(new Line2D.Double(x, AXIS_Y, x, y));
            String text = label(e);
            if (onLeft) {
                g.draw(new Line2D.Double(left - 10, y, x, y));
                text(g, placed, text, (float) (left - 14 - fm.stringWidth(text)), (float) (y + 4));
            } else {
                g.draw(new Line2D.Double(x, y, right + 10, y));
                text(g, placed, text, (float) (right + 14), (float) (y + 4));
            }
        }
        g.setStroke(new BasicStroke(4f, BasicStroke.CAP_ROUND, BasicStroke.JOIN_ROUND));
        int level = 0;
        for (int[] grp : groups) {
            double y = AXIS_Y + 10 + level * 6;
            double x0 = xOf.applyAsDouble(entries.get(grp[0]).meanRank()) - 3;
            double x1 = xOf.applyAsDouble(entries.get(grp[1]).meanRank()) + 3;
            g.draw(new Line2D.Double(x0, y, x1, y));
            placed.add(new Placed("bar", "group", new Rectangle2D.Double(x0 - 2, y - 2, x1 - x0 + 4, 4)));
            level++;
        }
    }

    /** Draws a text with its baseline at y and records its bounding box from the font's metrics. */
    private static void text(Graphics2D g, List<Placed> placed, String s, float x, float y) {
        FontMetrics fm = g.getFontMetrics();
        g.drawString(s, x, y);
        placed.add(new Placed("text", s, new Rectangle2D.Double(x, y - fm.getAscent(), fm.stringWidth(s),
                fm.getAscent() + fm.getDescent())));
    }

    private static String label(Entry e) {
        return String.format(Locale.ROOT, "%s (%.2f)", e.name(), e.meanRank());
    }
}

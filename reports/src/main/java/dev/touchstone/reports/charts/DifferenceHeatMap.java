package dev.touchstone.reports.charts;

import java.awt.BasicStroke;
import java.awt.Color;
import java.awt.Font;
import java.awt.FontMetrics;
import java.awt.Graphics2D;
import java.awt.geom.Rectangle2D;
import java.util.List;
import java.util.Locale;
import java.util.Objects;

/**
 * The paired differences of each configuration against the reference as a heat map: one block
 * of rows per metric (its own colour scale), one row per configuration, one column per setting, each cell coloured by the mean difference turned
 * so that blue means better than the reference and red worse (whatever the metric's
 * direction), with the value printed and a ring where the Holm-adjusted p-value is below
 * 0.05. The diverging scale runs between the end colours of the blue–red scheme that Tol
 * (2021, "Colour schemes", SRON/EPS/TN/09-002) recommends as colour-blind safe
 * (#2166AC, #F7F7F7, #B2182B, from memory), scaled to the largest absolute difference.
 */
public final class DifferenceHeatMap {

    /** One cell: metric and configuration (row), setting (column), mean difference and adjusted p-value (null: none). */
    public record Cell(String metric, String configuration, String setting, double difference, Double pAdjusted) {
    }

    /** A block of rows: a metric (its title in words and its direction; null: none) and its configurations. */
    public record Block(String metric, String title, Boolean higherIsBetter, List<String> configurations) {
        public Block {
            configurations = List.copyOf(configurations);
        }
    }

    static final Color BETTER = new Color(0x21, 0x66, 0xAC);
    static final Color NEUTRAL = new Color(0xF7, 0xF7, 0xF7);
    static final Color WORSE = new Color(0xB2, 0x18, 0x2B);
    private static final int ROW = 24;
    private static final Font FONT = new Font("SansSerif", Font.PLAIN, 10);
    private static final Font BOLD = new Font("SansSerif", Font.BOLD, 11);

    private final String title;
    private final List<Block> blocks;
    private final List<String> columns;
    private final List<Cell> cells;
    private final double alpha;

    /**
     * @param blocks  one per metric, configurations in the study's order
     * @param columns settings (short labels, lines split at ", ")
     */
    public DifferenceHeatMap(String title, List<Block> blocks, List<String> columns, List<Cell> cells) {
        this.title = Objects.requireNonNull(title);
        this.blocks = List.copyOf(blocks);
        this.columns = List.copyOf(columns);
        this.cells = List.copyOf(cells);
        this.alpha = 0.05;
    }

    /** The colour of a difference turned to "positive is better", on a scale of ±{@code max}. */
    static Color colour(double better, double max) {
        if (!(max > 0)) {
            return NEUTRAL;
        }
        double t = Math.max(-1, Math.min(1, better / max));
        Color end = t >= 0 ? BETTER : WORSE;
        double u = Math.abs(t);
        return new Color(mix(NEUTRAL.getRed(), end.getRed(), u), mix(NEUTRAL.getGreen(), end.getGreen(), u),
                mix(NEUTRAL.getBlue(), end.getBlue(), u));
    }

    private static int mix(int a, int b, double u) {
        return (int) Math.round(a + (b - a) * u);
    }

    private static double better(Block b, double d) {
        return b.higherIsBetter() == null || b.higherIsBetter() ? d : -d;
    }

    /** The heat map at this width as an {@code <svg>} element. */
    public String toSvg(int width) {
        return figure(width).toSvg();
    }

    /** The heat map at this width as a figure (for SVG and PDF); its height follows from the rows. */
    public Figure figure(int width) {
        FontMetrics fm = Svg.metrics(FONT);
        int widest = 0;
        for (Block b : blocks) {
            for (String r : b.configurations()) {
                widest = Math.max(widest, fm.stringWidth(r) + 16);
            }
        }
        int labelWidth = Math.min(widest + 12, width / 3);
        int headerLines = 1;
        for (String c : columns) {
            headerLines = Math.max(headerLines, c.split(", ").length);
        }
        int top = 26 + headerLines * 12 + 6;
        int cellWidth = Math.max(12, (width - labelWidth - 10) / Math.max(1, columns.size()));
        int rowCount = 0;
        for (Block b : blocks) {
            rowCount += b.configurations().size();
        }
        int height = top + blocks.size() * 18 + rowCount * ROW + 40;
        Grid grid = new Grid(width, height, labelWidth, top, cellWidth);
        return new Figure(width, height, g -> draw(g, fm, grid));
    }

    /** The sizes {@link #figure} works out: the picture, the label column, the top of the rows, a cell's width. */
    private record Grid(int width, int height, int labelWidth, int top, int cellWidth) {
    }

    private void draw(Graphics2D g, FontMetrics fm, Grid grid) {
        int width = grid.width();
        int labelWidth = grid.labelWidth();
        int cellWidth = grid.cellWidth();
        g.setColor(Color.WHITE);
        g.fillRect(0, 0, width, grid.height());
        g.setColor(Color.BLACK);
        g.setFont(new Font("SansSerif", Font.BOLD, 13));
        g.drawString(title, 6, 16);
        g.setFont(FONT);
        for (int j = 0; j < columns.size(); j++) {
            String[] lines = columns.get(j).split(", ");
            int x = labelWidth + j * cellWidth;
            for (int l = 0; l < lines.length; l++) {
                String text = fit(fm, lines[l], cellWidth - 2);
                g.drawString(text, x + (cellWidth - fm.stringWidth(text)) / 2f, 26 + (l + 1) * 12);
            }
        }
        boolean numbers = cellWidth >= 40;
        int y = grid.top();
        for (Block b : blocks) {
            double max = 0;
            for (Cell c : cells) {
                if (c.metric().equals(b.metric())) {
                    max = Math.max(max, Math.abs(c.difference()));
                }
            }
            g.setColor(Color.BLACK);
            g.setFont(BOLD);
            g.drawString(fit(fm, b.title() + " (colour scale ±" + number(max).replace("+", "") + ")",
                    width - 12), 6, y + 13);
            g.setFont(FONT);
            y += 18;
            for (String config : b.configurations()) {
                g.setColor(Color.BLACK);
                String label = fit(fm, config, labelWidth - 12);
                g.drawString(label, labelWidth - 6 - fm.stringWidth(label), y + ROW / 2f + 4);
                for (int j = 0; j < columns.size(); j++) {
                    Cell c = find(b.metric(), config, columns.get(j));
                    Rectangle2D box = new Rectangle2D.Double(labelWidth + j * cellWidth, y, cellWidth, ROW);
                    if (c == null) {
                        g.setColor(Color.WHITE);
                        g.fill(box);
                        g.setColor(new Color(0xBB, 0xBB, 0xBB));
                        g.drawString("–", (float) box.getCenterX() - 3, (float) box.getCenterY() + 4);
                    } else {
                        Color fill = colour(better(b, c.difference()), max);
                        g.setColor(fill);
                        g.fill(box);
                        boolean dark = 0.299 * fill.getRed() + 0.587 * fill.getGreen() + 0.114 * fill.getBlue() < 140;
                        g.setColor(dark ? Color.WHITE : Color.BLACK);
                        if (c.pAdjusted() != null && c.pAdjusted() < alpha) {
                            g.setStroke(new BasicStroke(2f));
                            g.draw(new Rectangle2D.Double(box.getX() + 2, box.getY() + 2, box.getWidth() - 4,
                                    box.getHeight() - 4));
                        }
                        if (numbers) {
                            String v = number(c.difference());
                            g.drawString(v, (float) (box.getCenterX() - fm.stringWidth(v) / 2.0),
                                    (float) box.getCenterY() + 4);
                        }
                    }
                    g.setColor(Color.WHITE);
                    g.setStroke(new BasicStroke(1f));
                    g.draw(box);
                }
                y += ROW;
            }
        }
        legend(g, fm, y + 12, labelWidth);
    }

    private void legend(Graphics2D g, FontMetrics fm, int y, int x) {
        int w = 120;
        for (int k = 0; k < w; k++) {
            g.setColor(colour(1 - 2.0 * k / (w - 1), 1));
            g.fillRect(x + k, y, 1, 10);
        }
        g.setColor(Color.BLACK);
        g.drawString("better", x - 4 - fm.stringWidth("better"), y + 9);
        g.drawString("worse than the reference", x + w + 4, y + 9);
        int lx = x + w + 14 + fm.stringWidth("worse than the reference");
        g.setStroke(new BasicStroke(2f));
        g.drawRect(lx, y, 14, 10);
        g.drawString("Holm-adjusted p < " + alpha + "; – no pairs", lx + 20, y + 9);
    }

    private Cell find(String metric, String row, String column) {
        for (Cell c : cells) {
            if (c.metric().equals(metric) && c.configuration().equals(row) && c.setting().equals(column)) {
                return c;
            }
        }
        return null;
    }

    private static String fit(FontMetrics fm, String s, int width) {
        if (fm.stringWidth(s) <= width) {
            return s;
        }
        String t = s;
        while (t.length() > 1 && fm.stringWidth(t + "…") > width) {
            t = t.substring(0, t.length() - 1);
        }
        return t + "…";
    }

    static String number(double v) {
        if (v == 0) {
            return "0";
        }
        double a = Math.abs(v);
        String s = a >= 10 ? String.format(Locale.ROOT, "%.0f", v)
                : a >= 1 ? String.format(Locale.ROOT, "%.1f", v) : String.format(Locale.ROOT, "%.2g", v);
        return (v > 0 ? "+" : "") + s;
    }

}

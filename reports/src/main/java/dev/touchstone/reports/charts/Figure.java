package dev.touchstone.reports.charts;

import org.jfree.chart.JFreeChart;

import java.awt.Graphics2D;
import java.awt.Rectangle;
import java.util.Objects;
import java.util.function.Consumer;

/**
 * A chart as a drawing of fixed size that can be replayed onto any Java2D canvas, so one piece
 * of drawing code renders the same picture to SVG ({@link Svg}, for the page and
 * {@code figures/*.svg}) and to PDF ({@link Pdf}, for a paper). The painter draws in the
 * rectangle (0, 0)–(width, height) of the canvas it is given and may be run any number of
 * times; it must not keep state between runs.
 *
 * @param width   width in pixels (one PDF point each)
 * @param height  height in pixels
 * @param painter the drawing
 */
public record Figure(int width, int height, Consumer<Graphics2D> painter) {

    public Figure {
        if (width <= 0 || height <= 0) {
            throw new IllegalArgumentException("a figure needs a positive size, got " + width + " × " + height);
        }
        Objects.requireNonNull(painter, "painter");
    }

    /** A JFreeChart chart drawn over the whole figure. */
    public static Figure of(JFreeChart chart, int width, int height) {
        return new Figure(width, height, g -> chart.draw(g, new Rectangle(0, 0, width, height)));
    }

    /** Replays the drawing onto {@code g}. */
    public void draw(Graphics2D g) {
        painter.accept(g);
    }

    /** The figure as an inline {@code <svg>} element. */
    public String toSvg() {
        return Svg.of(this);
    }

    /** The figure as a one-page PDF document of its own size. */
    public byte[] toPdf() {
        return Pdf.of(this);
    }
}

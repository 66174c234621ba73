package dev.touchstone.reports.charts;

import org.jfree.chart.JFreeChart;
import org.jfree.svg.SVGGraphics2D;

import java.awt.Rectangle;
import java.util.concurrent.atomic.AtomicLong;

/**
 * Renders Java2D drawings and JFreeChart charts to inline SVG elements with JFreeSVG.
 * Each drawing gets its own prefix for clip-path and gradient ids, so many charts can be
 * inlined in one HTML page without their ids colliding.
 */
public final class Svg {

    private static final AtomicLong COUNTER = new AtomicLong();

    private Svg() {
    }

    /** A fresh canvas of this size with a unique id prefix. */
    public static SVGGraphics2D canvas(int width, int height) {
        SVGGraphics2D g = new SVGGraphics2D(width, height);
        g.setDefsKeyPrefix("c" + COUNTER.incrementAndGet() + "_");
        return g;
    }

    /** The chart drawn at this size, as an {@code <svg>} element. */
    public static String of(JFreeChart chart, int width, int height) {
        SVGGraphics2D g = canvas(width, height);
        chart.draw(g, new Rectangle(0, 0, width, height));
        return g.getSVGElement();
    }
}

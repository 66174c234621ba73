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

    /**
     * The drawing as an {@code <svg>} element with its size and a view box, so that a page may
     * scale it down to the width it has (CSS max-width) instead of cutting it off.
     */
    public static String element(SVGGraphics2D g) {
        return g.getSVGElement(null, true, new org.jfree.svg.ViewBox(0, 0, g.getWidth(), g.getHeight()), null, null);
    }

    /**
     * An inline {@code <svg>} element as a standalone SVG 1.1 file: XML declaration first and
     * the SVG namespace declared (JFreeSVG's element already carries it; added when missing).
     */
    public static String standalone(String svgElement) {
        if (!svgElement.startsWith("<svg")) {
            throw new IllegalArgumentException("not an <svg> element");
        }
        String openingTag = svgElement.substring(0, svgElement.indexOf('>') + 1);
        String svg = openingTag.matches("(?s).*\\sxmlns=[\"']http://www\\.w3\\.org/2000/svg[\"'].*") ? svgElement
                : "<svg xmlns=\"http://www.w3.org/2000/svg\"" + svgElement.substring(4);
        return "<?xml version=\"1.0\" encoding=\"UTF-8\"?>\n" + svg + "\n";
    }

    /** The chart drawn at this size, as an {@code <svg>} element. */
    public static String of(JFreeChart chart, int width, int height) {
        SVGGraphics2D g = canvas(width, height);
        chart.draw(g, new Rectangle(0, 0, width, height));
        return Svg.element(g);
    }
}

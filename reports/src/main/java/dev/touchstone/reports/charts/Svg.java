package dev.touchstone.reports.charts;

import org.jfree.svg.SVGGraphics2D;

import java.awt.Font;
import java.awt.FontMetrics;
import java.util.concurrent.atomic.AtomicLong;

/**
 * Renders {@link Figure}s (Java2D drawings, JFreeChart charts among them) to inline SVG elements
 * with JFreeSVG.
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

    /** The metrics of a font as the SVG canvas measures it, for laying a figure out before drawing it. */
    public static FontMetrics metrics(Font font) {
        return canvas(1, 1).getFontMetrics(font);
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

    /** The figure drawn on a fresh canvas of its size, as an {@code <svg>} element. */
    public static String of(Figure figure) {
        SVGGraphics2D g = canvas(figure.width(), figure.height());
        figure.draw(g);
        return element(g);
    }
}

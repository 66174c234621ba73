package dev.touchstone.reports.charts;

import java.awt.BasicStroke;
import java.awt.Color;
import java.awt.Shape;
import java.awt.Stroke;
import java.awt.geom.Ellipse2D;
import java.awt.geom.Path2D;
import java.awt.geom.Rectangle2D;

/**
 * The visual identity of a series: colour, dash pattern and marker shape, all fixed by the
 * series' identity index (a learner configuration's position in the study's learner order),
 * so that one configuration looks the same in every chart and table of a report.
 *
 * <p>The colours are exactly the eight of the colour-blind-safe palette of Okabe and Ito
 * (2008, "Color universal design (CUD): how to make figures and presentations that are
 * friendly to colorblind people", J*Fly), in an order that puts the strongest contrasts on
 * white first. Marker shapes repeat every five and colours every eight, so the first forty
 * identities differ in the pair (colour, marker) and ten in the dash pattern too; series
 * stay distinguishable in greyscale through marker and dash.
 */
public final class SeriesStyle {

    /** Okabe–Ito (2008) colours, values as published (from memory): blue, vermillion, bluish green,
     * reddish purple, orange, sky blue, black, yellow. */
    static final Color[] COLOURS = {
        new Color(0x00, 0x72, 0xB2), new Color(0xD5, 0x5E, 0x00), new Color(0x00, 0x9E, 0x73),
        new Color(0xCC, 0x79, 0xA7), new Color(0xE6, 0x9F, 0x00), new Color(0x56, 0xB4, 0xE9),
        new Color(0x00, 0x00, 0x00), new Color(0xF0, 0xE4, 0x42),
    };

    /** Number of marker shapes. */
    static final int SHAPES = 5;

    private static final float[][] DASHES = {
        null, {6f, 3f}, {2f, 2f}, {8f, 3f, 2f, 3f}, {12f, 4f}, {4f, 2f, 1f, 2f}, null, {3f, 5f},
        {10f, 2f, 2f, 2f, 2f, 2f}, {1f, 3f},
    };

    private SeriesStyle() {
    }

    public static Color colour(int identity) {
        return COLOURS[Math.floorMod(identity, COLOURS.length)];
    }

    /** The colour as CSS {@code #rrggbb}, for swatches in HTML tables. */
    public static String css(int identity) {
        Color c = colour(identity);
        return String.format(java.util.Locale.ROOT, "#%02x%02x%02x", c.getRed(), c.getGreen(), c.getBlue());
    }

    /** Index of the marker shape of an identity (0 circle, 1 square, 2 triangle up, 3 diamond, 4 triangle down). */
    public static int shapeIndex(int identity) {
        return Math.floorMod(identity, SHAPES);
    }

    /**
     * A small inline {@code <svg class="swatch">} of an identity's marker in its colour, for
     * tables and legends in HTML.
     */
    public static String swatchSvg(int identity) {
        StringBuilder d = new StringBuilder();
        double[] c = new double[6];
        for (java.awt.geom.PathIterator it = shape(identity, 10).getPathIterator(null, 0.3); !it.isDone(); it.next()) {
            int type = it.currentSegment(c);
            if (type == java.awt.geom.PathIterator.SEG_CLOSE) {
                d.append("Z");
            } else {
                d.append(type == java.awt.geom.PathIterator.SEG_MOVETO ? "M" : "L")
                        .append(String.format(java.util.Locale.ROOT, "%.2f %.2f ", c[0], c[1]));
            }
        }
        return "<svg class=\"swatch\" xmlns=\"http://www.w3.org/2000/svg\" width=\"14\" height=\"14\""
                + " viewBox=\"-7 -7 14 14\" data-identity=\"" + identity + "\"><path d=\"" + d.toString().trim()
                + "\" fill=\"" + css(identity) + "\" stroke=\"#333\" stroke-width=\"0.6\"/></svg>";
    }

    public static Stroke stroke(int identity) {
        float[] dash = DASHES[Math.floorMod(identity, DASHES.length)];
        return dash == null
                ? new BasicStroke(2f, BasicStroke.CAP_ROUND, BasicStroke.JOIN_ROUND)
                : new BasicStroke(2f, BasicStroke.CAP_BUTT, BasicStroke.JOIN_ROUND, 10f, dash, 0f);
    }

    public static Shape shape(int identity) {
        return shape(identity, 7);
    }

    /** The marker of an identity at size {@code s}, centred on the origin. */
    public static Shape shape(int identity, double s) {
        switch (shapeIndex(identity)) {
            case 0:
                return new Ellipse2D.Double(-s / 2, -s / 2, s, s);
            case 1:
                return new Rectangle2D.Double(-s / 2, -s / 2, s, s);
            case 2:
                return triangle(s, true);
            case 3:
                return diamond(s);
            default:
                return triangle(s, false);
        }
    }

    private static Shape triangle(double s, boolean up) {
        Path2D p = new Path2D.Double();
        double h = up ? -s / 2 : s / 2;
        p.moveTo(0, h);
        p.lineTo(s / 2, -h);
        p.lineTo(-s / 2, -h);
        p.closePath();
        return p;
    }

    private static Shape diamond(double s) {
        Path2D p = new Path2D.Double();
        p.moveTo(0, -s / 2);
        p.lineTo(s / 2, 0);
        p.lineTo(0, s / 2);
        p.lineTo(-s / 2, 0);
        p.closePath();
        return p;
    }
}

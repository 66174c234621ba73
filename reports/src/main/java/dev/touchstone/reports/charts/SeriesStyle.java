package dev.touchstone.reports.charts;

import java.awt.BasicStroke;
import java.awt.Color;
import java.awt.Shape;
import java.awt.Stroke;
import java.awt.geom.Ellipse2D;
import java.awt.geom.Path2D;
import java.awt.geom.Rectangle2D;

/**
 * Colours, dash patterns and point shapes for up to ten series, chosen so that series can
 * be told apart in greyscale too (shape and dash differ, not only colour). The colours are
 * the colour-blind-safe palette of Okabe and Ito (2008, "Color universal design"), with two
 * darker greys added to reach ten.
 */
public final class SeriesStyle {

    private static final Color[] COLOURS = {
        new Color(0x00, 0x72, 0xB2), new Color(0xD5, 0x5E, 0x00), new Color(0x00, 0x9E, 0x73),
        new Color(0xCC, 0x79, 0xA7), new Color(0xE6, 0x9F, 0x00), new Color(0x56, 0xB4, 0xE9),
        new Color(0x00, 0x00, 0x00), new Color(0xF0, 0xE4, 0x42).darker(), new Color(0x66, 0x66, 0x66),
        new Color(0x99, 0x44, 0x00),
    };

    private static final float[][] DASHES = {
        null, {6f, 3f}, {2f, 2f}, {8f, 3f, 2f, 3f}, {12f, 4f}, {4f, 2f, 1f, 2f}, null, {3f, 5f},
        {10f, 2f, 2f, 2f, 2f, 2f}, {1f, 3f},
    };

    private SeriesStyle() {
    }

    public static Color colour(int series) {
        return COLOURS[Math.floorMod(series, COLOURS.length)];
    }

    public static Stroke stroke(int series) {
        float[] dash = DASHES[Math.floorMod(series, DASHES.length)];
        return dash == null
                ? new BasicStroke(2f, BasicStroke.CAP_ROUND, BasicStroke.JOIN_ROUND)
                : new BasicStroke(2f, BasicStroke.CAP_BUTT, BasicStroke.JOIN_ROUND, 10f, dash, 0f);
    }

    public static Shape shape(int series) {
        double s = 7;
        switch (Math.floorMod(series, 5)) {
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

package dev.touchstone.reports.charts;

import org.jfree.chart.axis.LogAxis;
import org.jfree.chart.axis.NumberTick;
import org.jfree.chart.axis.TickType;
import org.jfree.chart.ui.RectangleEdge;
import org.jfree.chart.ui.TextAnchor;

import java.awt.Graphics2D;
import java.awt.geom.Rectangle2D;
import java.text.DecimalFormat;
import java.text.DecimalFormatSymbols;
import java.util.ArrayList;
import java.util.List;
import java.util.Locale;

/**
 * A base-10 logarithmic axis whose labelled ticks are 1, 2 and 5 times the powers of ten
 * (the "1-2-5" sequence of preferred numbers, as on the decade scales of engineering graph
 * paper and oscilloscopes; common practice) when the range spans at most four decades, and the
 * powers of ten alone beyond, printed as plain numbers (20, 500) rather than exponents.
 */
public final class OneTwoFiveLogAxis extends LogAxis {

    private static final long serialVersionUID = 1L;
    private static final double[] STEPS = {1, 2, 5};

    public OneTwoFiveLogAxis(String label) {
        super(label);
        setBase(10);
        setSmallestValue(1e-9);
        setMinorTickMarksVisible(false);
    }

    /**
     * The tick values for a data range [lower, upper] (both positive). A range too narrow for
     * three 1-2-5 ticks (8 to 16 variables) gets evenly spaced ones at a 1-2-5 step instead.
     */
    public static List<Double> ticks(double lower, double upper) {
        List<Double> out = decades(lower, upper);
        if (out.size() >= 3 || !(lower > 0) || !(upper > lower)) {
            return out;
        }
        double raw = (upper - lower) / 4;
        double power = Math.pow(10, Math.floor(Math.log10(raw)));
        double step = power;
        for (double s : STEPS) {
            if (s * power <= raw * 1.5) {
                step = s * power;
            }
        }
        List<Double> even = new ArrayList<>();
        for (double v = Math.ceil(lower / step) * step; v <= upper * (1 + 1e-9); v += step) {
            even.add(Double.parseDouble(String.format(Locale.ROOT, "%.6g", v)));
        }
        return even.size() >= out.size() ? even : out;
    }

    private static List<Double> decades(double lower, double upper) {
        List<Double> out = new ArrayList<>();
        if (!(lower > 0) || !(upper >= lower)) {
            return out;
        }
        int first = (int) Math.floor(Math.log10(lower));
        int last = (int) Math.ceil(Math.log10(upper));
        boolean fine = last - first <= 4;
        for (int e = first; e <= last; e++) {
            for (double s : fine ? STEPS : new double[] {1}) {
                double v = s * Math.pow(10, e);
                // Round away binary noise (2e-3 as 0.0020000000000000005) so labels read as typed.
                v = Double.parseDouble(String.format(Locale.ROOT, "%.6g", v));
                if (v >= lower * (1 - 1e-9) && v <= upper * (1 + 1e-9)) {
                    out.add(v);
                }
            }
        }
        return out;
    }

    /** A tick's label: the number as written by hand (0.002, 50, 2000). */
    public static String label(double v) {
        DecimalFormat f = new DecimalFormat("0.#########", DecimalFormatSymbols.getInstance(Locale.ROOT));
        return f.format(v);
    }

    @Override
    protected List refreshTicksHorizontal(Graphics2D g2, Rectangle2D dataArea, RectangleEdge edge) {
        return make(edge == RectangleEdge.TOP ? TextAnchor.BOTTOM_CENTER : TextAnchor.TOP_CENTER);
    }

    @Override
    protected List refreshTicksVertical(Graphics2D g2, Rectangle2D dataArea, RectangleEdge edge) {
        return make(edge == RectangleEdge.RIGHT ? TextAnchor.CENTER_LEFT : TextAnchor.CENTER_RIGHT);
    }

    private List<NumberTick> make(TextAnchor anchor) {
        List<NumberTick> out = new ArrayList<>();
        for (double v : ticks(getLowerBound(), getUpperBound())) {
            out.add(new NumberTick(TickType.MAJOR, v, label(v), anchor, TextAnchor.CENTER, 0.0));
        }
        return out;
    }
}

package dev.touchstone.reports.charts;

import dev.touchstone.core.graph.Edge;
import dev.touchstone.core.graph.Graph;
import dev.touchstone.core.graph.Mark;
import org.jgrapht.alg.drawing.model.Point2D;

import java.awt.BasicStroke;
import java.awt.Color;
import java.awt.Font;
import java.awt.FontMetrics;
import java.awt.Graphics2D;
import java.awt.Stroke;
import java.awt.geom.Ellipse2D;
import java.awt.geom.Line2D;
import java.awt.geom.Path2D;
import java.awt.geom.QuadCurve2D;
import java.util.EnumMap;
import java.util.Map;

/**
 * The truth beside an estimate, over the same variables at the same positions: a
 * {@link GraphLayout} computed from the truth alone (layered by causal order), so every
 * estimate of one truth is drawn over one layout. Edges are told apart by line style as well
 * as colour, so the picture reads in greyscale: correct solid black, missing (truth panel)
 * dashed grey, extra dotted red, wrong marks dash-dot orange. Arrowheads are filled
 * triangles, circles open circles, tails plain line ends.
 */
public final class GraphPicture {

    private static final int TOP = 24;
    private static final double NODE_RADIUS = GraphLayout.RADIUS;
    private static final Map<EdgeVerdict, Color> COLOURS = new EnumMap<>(Map.of(
            EdgeVerdict.CORRECT, new Color(0x22, 0x22, 0x22),
            EdgeVerdict.MISSING, new Color(0x88, 0x88, 0x88),
            EdgeVerdict.EXTRA, new Color(0xC0, 0x20, 0x20),
            EdgeVerdict.WRONG_MARKS, new Color(0xE0, 0x80, 0x00)));

    private final Graph truth;
    private final Graph estimate;
    private final GraphLayout layout;

    /**
     * @param truth    the truth, of the estimate's class, over the same variables in the same order
     * @param estimate the estimate
     * @param layout   the truth's layout (shared by every estimate of it)
     */
    public GraphPicture(Graph truth, Graph estimate, GraphLayout layout) {
        if (!truth.names().equals(estimate.names())) {
            throw new IllegalArgumentException("truth and estimate must be over the same variables");
        }
        if (layout.size() != truth.size()) {
            throw new IllegalArgumentException("the layout has " + layout.size() + " nodes, the truth " + truth.size());
        }
        this.truth = truth;
        this.estimate = estimate;
        this.layout = layout;
    }

    /** How the edge between {@code a} and {@code b} of {@code in} compares with {@code other}. */
    public static EdgeVerdict verdict(Graph in, Graph other, int a, int b, boolean inIsTruth) {
        Edge e = in.edge(a, b);
        Edge o = other.edge(a, b);
        if (o == null) {
            return inIsTruth ? EdgeVerdict.MISSING : EdgeVerdict.EXTRA;
        }
        return e.atA() == o.atA() && e.atB() == o.atB() ? EdgeVerdict.CORRECT : EdgeVerdict.WRONG_MARKS;
    }

    /** Both panels side by side with a legend, as an {@code <svg>} element. */
    public String toSvg() {
        return figure().toSvg();
    }

    /** Both panels side by side with a legend, as a figure (for SVG and PDF). */
    public Figure figure() {
        int panel = (int) Math.ceil(layout.width());
        int width = 2 * panel + 20;
        int height = (int) Math.ceil(layout.height()) + TOP + 36;
        return new Figure(width, height, g -> draw(g, panel, width, height));
    }

    private void draw(Graphics2D g, int panel, int width, int height) {
        Point2D[] at = new Point2D[truth.size()];
        for (int v = 0; v < at.length; v++) {
            at[v] = Point2D.of(layout.x(v), TOP + layout.y(v));
        }
        g.setColor(Color.WHITE);
        g.fillRect(0, 0, width, height);
        g.setFont(new Font("SansSerif", Font.BOLD, 12));
        g.setColor(Color.BLACK);
        g.drawString("truth", 10, 16);
        g.drawString("estimate", panel + 30, 16);
        panel(g, truth, estimate, at, 0, true);
        panel(g, estimate, truth, at, panel + 20, false);
        legend(g, height - 14);
    }

    private void panel(Graphics2D g, Graph drawn, Graph other, Point2D[] at, int dx, boolean isTruth) {
        for (Edge e : drawn.edges()) {
            EdgeVerdict v = verdict(drawn, other, e.a(), e.b(), isTruth);
            Point2D a = shift(at[e.a()], dx);
            Point2D b = shift(at[e.b()], dx);
            g.setColor(COLOURS.get(v));
            g.setStroke(stroke(v));
            if (Math.hypot(b.getX() - a.getX(), b.getY() - a.getY()) < 1e-6) {
                continue;
            }
            Point2D c = control(e.a(), e.b());
            Point2D cs = c == null ? null : shift(Point2D.of(c.getX(), TOP + c.getY()), dx);
            // the directions into the edge at each end: towards the other end, or towards the curve's control point
            Point2D towardsB = cs == null ? b : cs;
            Point2D towardsA = cs == null ? a : cs;
            double la = Math.hypot(towardsB.getX() - a.getX(), towardsB.getY() - a.getY());
            double lb = Math.hypot(towardsA.getX() - b.getX(), towardsA.getY() - b.getY());
            double ux = (towardsB.getX() - a.getX()) / la;
            double uy = (towardsB.getY() - a.getY()) / la;
            double vx = (towardsA.getX() - b.getX()) / lb;
            double vy = (towardsA.getY() - b.getY()) / lb;
            double ax = a.getX() + ux * NODE_RADIUS;
            double ay = a.getY() + uy * NODE_RADIUS;
            double bx = b.getX() + vx * NODE_RADIUS;
            double by = b.getY() + vy * NODE_RADIUS;
            if (cs == null) {
                g.draw(new Line2D.Double(ax, ay, bx, by));
            } else {
                g.draw(new QuadCurve2D.Double(ax, ay, cs.getX(), cs.getY(), bx, by));
            }
            g.setStroke(new BasicStroke(1.2f));
            mark(g, e.atA(), ax, ay, ux, uy);
            mark(g, e.atB(), bx, by, vx, vy);
        }
        g.setFont(new Font("SansSerif", Font.PLAIN, 10));
        FontMetrics fm = g.getFontMetrics();
        for (int v = 0; v < drawn.size(); v++) {
            Point2D p = shift(at[v], dx);
            Ellipse2D node = new Ellipse2D.Double(p.getX() - NODE_RADIUS, p.getY() - NODE_RADIUS,
                    2 * NODE_RADIUS, 2 * NODE_RADIUS);
            g.setColor(new Color(0xF4, 0xF4, 0xF4));
            g.fill(node);
            g.setColor(Color.BLACK);
            g.setStroke(new BasicStroke(1f));
            g.draw(node);
            String name = shorten(drawn.name(v));
            g.drawString(name, (float) (p.getX() - fm.stringWidth(name) / 2.0), (float) (p.getY() + 4));
        }
    }

    /**
     * The control point (layout coordinates) of a quadratic curve for the edge a–b when the
     * straight line would pass within {@link GraphLayout#CLEARANCE} of a third node (an
     * estimate's extra edge, which the truth's layout did not plan for); null when a straight
     * line is clear. Bends further, on either side, until the curve clears every third node.
     */
    Point2D control(int a, int b) {
        if (clear(a, b, null)) {
            return null;
        }
        double ax = layout.x(a);
        double ay = layout.y(a);
        double bx = layout.x(b);
        double by = layout.y(b);
        double len = Math.hypot(bx - ax, by - ay);
        double nx = -(by - ay) / len;
        double ny = (bx - ax) / len;
        double mx = (ax + bx) / 2;
        double my = (ay + by) / 2;
        Point2D fallback = null;
        // Bend sideways, the apex also slid along the edge, until the curve passes every third node.
        for (double bend = 30; bend <= 600; bend += 15) {
            for (double slide : new double[] {0, 0.25, -0.25, 0.5, -0.5}) {
                for (int side : new int[] {1, -1}) {
                    Point2D c = Point2D.of(mx + side * nx * bend - slide * ny * len,
                            my + side * ny * bend + slide * nx * len);
                    if (fallback == null) {
                        fallback = c;
                    }
                    if (clear(a, b, c)) {
                        return c;
                    }
                }
            }
        }
        return fallback;
    }

    /** Whether the edge a–b (straight, or the quadratic curve through control c) keeps clear of every third node. */
    private boolean clear(int a, int b, Point2D c) {
        java.awt.Shape shape = c == null ? new Line2D.Double(layout.x(a), layout.y(a), layout.x(b), layout.y(b))
                : new QuadCurve2D.Double(layout.x(a), layout.y(a), c.getX(), c.getY(), layout.x(b), layout.y(b));
        double[] pt = new double[6];
        double px = 0;
        double py = 0;
        for (java.awt.geom.PathIterator it = shape.getPathIterator(null, 0.5); !it.isDone(); it.next()) {
            int type = it.currentSegment(pt);
            if (type == java.awt.geom.PathIterator.SEG_LINETO) {
                for (int w = 0; w < layout.size(); w++) {
                    if (w != a && w != b && GraphLayout.distanceToSegment(layout.x(w), layout.y(w), px, py, pt[0],
                            pt[1]) < GraphLayout.CLEARANCE) {
                        return false;
                    }
                }
            }
            px = pt[0];
            py = pt[1];
        }
        return true;
    }

    /** Draws the mark at an end point; (ux, uy) points from that end into the edge. */
    private static void mark(Graphics2D g, Mark m, double x, double y, double ux, double uy) {
        if (m == Mark.ARROW) {
            double len = 9;
            double w = 4.5;
            Path2D p = new Path2D.Double();
            p.moveTo(x, y);
            p.lineTo(x + ux * len - uy * w, y + uy * len + ux * w);
            p.lineTo(x + ux * len + uy * w, y + uy * len - ux * w);
            p.closePath();
            g.fill(p);
        } else if (m == Mark.CIRCLE) {
            double r = 3.5;
            Ellipse2D c = new Ellipse2D.Double(x + ux * r - r, y + uy * r - r, 2 * r, 2 * r);
            Color line = g.getColor();
            g.setColor(Color.WHITE);
            g.fill(c);
            g.setColor(line);
            g.draw(c);
        }
    }

    private static Point2D shift(Point2D p, int dx) {
        return Point2D.of(p.getX() + dx, p.getY());
    }

    private static String shorten(String name) {
        return name.length() <= 6 ? name : name.substring(0, 5) + "…";
    }

    private static Stroke stroke(EdgeVerdict v) {
        switch (v) {
            case MISSING:
                return new BasicStroke(1.6f, BasicStroke.CAP_BUTT, BasicStroke.JOIN_ROUND, 10f, new float[] {7f, 4f}, 0f);
            case EXTRA:
                return new BasicStroke(1.8f, BasicStroke.CAP_ROUND, BasicStroke.JOIN_ROUND, 10f, new float[] {1f, 4f}, 0f);
            case WRONG_MARKS:
                return new BasicStroke(1.8f, BasicStroke.CAP_BUTT, BasicStroke.JOIN_ROUND, 10f,
                        new float[] {9f, 3f, 2f, 3f}, 0f);
            default:
                return new BasicStroke(1.6f);
        }
    }

    private static void legend(Graphics2D g, int y) {
        g.setFont(new Font("SansSerif", Font.PLAIN, 11));
        int x = 10;
        for (EdgeVerdict v : EdgeVerdict.values()) {
            g.setColor(COLOURS.get(v));
            g.setStroke(stroke(v));
            g.draw(new Line2D.Double(x, y, x + 34, y));
            g.setColor(Color.BLACK);
            String label = v.name().toLowerCase(java.util.Locale.ROOT).replace('_', ' ');
            g.drawString(label, x + 40, y + 4);
            x += 40 + g.getFontMetrics().stringWidth(label) + 24;
        }
    }
}

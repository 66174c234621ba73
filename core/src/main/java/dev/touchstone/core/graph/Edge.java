package dev.touchstone.core.graph;

import java.util.Objects;

/**
 * One edge between the variables at indices {@code a} and {@code b}, with the mark at each end.
 *
 * <p>Values are immutable; {@link Graph#edges()} returns them canonically with {@code a < b}.
 */
public record Edge(int a, int b, Mark atA, Mark atB) {

    public Edge {
        if (a == b) {
            throw new IllegalArgumentException("an edge needs two different variables, got " + a + " twice");
        }
        if (a < 0 || b < 0) {
            throw new IllegalArgumentException("variable indices must be non-negative: " + a + ", " + b);
        }
        Objects.requireNonNull(atA, "atA");
        Objects.requireNonNull(atB, "atB");
    }

    /** The edge from → to (tail at {@code from}, arrow at {@code to}). */
    public static Edge directed(int from, int to) {
        return new Edge(from, to, Mark.TAIL, Mark.ARROW);
    }

    /** The undirected edge a — b. */
    public static Edge undirected(int a, int b) {
        return new Edge(a, b, Mark.TAIL, Mark.TAIL);
    }

    /** The bidirected edge a ↔ b. */
    public static Edge bidirected(int a, int b) {
        return new Edge(a, b, Mark.ARROW, Mark.ARROW);
    }

    /** The same edge written with the smaller index first. */
    public Edge canonical() {
        return a < b ? this : new Edge(b, a, atB, atA);
    }

    /** The mark at {@code node}, which must be one of the two ends. */
    public Mark markAt(int node) {
        if (node == a) {
            return atA;
        }
        if (node == b) {
            return atB;
        }
        throw new IllegalArgumentException("variable " + node + " is not an end of " + this);
    }

    /** The end that is not {@code node}. */
    public int other(int node) {
        if (node == a) {
            return b;
        }
        if (node == b) {
            return a;
        }
        throw new IllegalArgumentException("variable " + node + " is not an end of " + this);
    }

    /** True for a tail at one end and an arrow at the other. */
    public boolean isDirected() {
        return (atA == Mark.TAIL && atB == Mark.ARROW) || (atA == Mark.ARROW && atB == Mark.TAIL);
    }

    /** True when this edge is {@code from → to}. */
    public boolean isDirectedFrom(int from) {
        return isDirected() && markAt(from) == Mark.TAIL;
    }

    /**
     * The end a directed edge leaves: {@code a} when it is {@code a → b}, otherwise {@code b}
     * (so, for a directed edge, the variable its arrow points away from).
     */
    public int tail() {
        return isDirectedFrom(a) ? a : b;
    }

    /** True for tails at both ends. */
    public boolean isUndirected() {
        return atA == Mark.TAIL && atB == Mark.TAIL;
    }

    /** True for arrows at both ends. */
    public boolean isBidirected() {
        return atA == Mark.ARROW && atB == Mark.ARROW;
    }
}

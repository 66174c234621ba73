package dev.touchstone.metrics.scoring;

import dev.touchstone.core.graph.Graph;
import dev.touchstone.core.graph.Mark;

/**
 * The counts every structural metric is a ratio or sum of, gathered in one pass over the
 * edges of a truth and an estimate over the same variables in the same order.
 *
 * <p>Cost: O(p + E_truth + E_estimate) time, merging the two sorted adjacency rows of each
 * variable; no allocation beyond these records.
 *
 * @param variables p, the number of variables
 * @param edges     pairs adjacent in the truth, in the estimate, in both, and in both with the same marks
 * @param arrows    arrowhead endpoints: an estimated arrowhead at x on {x, y} is correct where the
 *                  truth has an edge on {x, y} with an arrowhead at x
 * @param tails     tail endpoints: an estimated tail is correct where the truth has a tail at the
 *                  same end of the same pair
 * @param directed  the calls on estimated edges by the rule of Zheng et al. (2018)
 */
public record EdgeCounts(int variables, Adjacencies edges, Endpoints arrows, Endpoints tails, DirectedCalls directed) {

    /**
     * Counts of adjacent pairs.
     *
     * @param inTruth    pairs adjacent in the truth
     * @param inEstimate pairs adjacent in the estimate
     * @param common     pairs adjacent in both
     * @param identical  pairs adjacent in both with the same mark at each end
     */
    public record Adjacencies(long inTruth, long inEstimate, long common, long identical) {
    }

    /**
     * Counts of the endpoints that carry one mark.
     *
     * @param inTruth    endpoints with the mark in the truth
     * @param inEstimate endpoints with the mark in the estimate
     * @param correct    estimated ones matched by the truth at the same end of the same pair
     */
    public record Endpoints(long inTruth, long inEstimate, long correct) {
    }

    /**
     * Estimated edges on true-adjacent pairs, called as Zheng et al. (2018) call them.
     *
     * @param hits     true positives: a directed edge x → y whose truth has no arrowhead at x, or an
     *                 undirected edge (treated favourably)
     * @param reversed directed edges x → y whose truth has an arrowhead at x (reversed, or
     *                 bidirected in a MAG truth)
     */
    public record DirectedCalls(long hits, long reversed) {
    }

    /** Counts for a truth and an estimate over the same variables in the same index order. */
    public static EdgeCounts of(Graph truth, Graph estimate) {
        if (!truth.names().equals(estimate.names())) {
            throw new IllegalArgumentException("truth and estimate must list the same variables in the same order");
        }
        long common = 0;
        long identical = 0;
        long trueArrows = 0;
        long estArrows = 0;
        long correctArrows = 0;
        long trueTails = 0;
        long estTails = 0;
        long correctTails = 0;
        long hits = 0;
        long reversed = 0;
        int p = truth.size();
        for (int v = 0; v < p; v++) {
            int dt = truth.degree(v);
            int de = estimate.degree(v);
            // one merge of v's two sorted rows; every endpoint mark is counted at its own node v
            int kt = 0;
            int ke = 0;
            while (kt < dt || ke < de) {
                int wt = kt < dt ? truth.neighbour(v, kt) : Integer.MAX_VALUE;
                int we = ke < de ? estimate.neighbour(v, ke) : Integer.MAX_VALUE;
                if (wt < we) {
                    Mark m = truth.markHere(v, kt++);
                    trueArrows += m == Mark.ARROW ? 1 : 0;
                    trueTails += m == Mark.TAIL ? 1 : 0;
                } else if (we < wt) {
                    Mark m = estimate.markHere(v, ke++);
                    estArrows += m == Mark.ARROW ? 1 : 0;
                    estTails += m == Mark.TAIL ? 1 : 0;
                } else {
                    Mark tHere = truth.markHere(v, kt);
                    Mark eHere = estimate.markHere(v, ke);
                    trueArrows += tHere == Mark.ARROW ? 1 : 0;
                    trueTails += tHere == Mark.TAIL ? 1 : 0;
                    estArrows += eHere == Mark.ARROW ? 1 : 0;
                    estTails += eHere == Mark.TAIL ? 1 : 0;
                    if (eHere == tHere) {
                        if (eHere == Mark.ARROW) {
                            correctArrows++;
                        } else if (eHere == Mark.TAIL) {
                            correctTails++;
                        }
                    }
                    if (v < wt) {
                        Mark tThere = truth.markThere(v, kt);
                        Mark eThere = estimate.markThere(v, ke);
                        common++;
                        if (tHere == eHere && tThere == eThere) {
                            identical++;
                        }
                        if (eHere == Mark.TAIL && eThere == Mark.TAIL) {
                            hits++;
                        } else if (eHere == Mark.TAIL && eThere == Mark.ARROW) {
                            if (tHere == Mark.ARROW) {
                                reversed++;
                            } else {
                                hits++;
                            }
                        } else if (eHere == Mark.ARROW && eThere == Mark.TAIL) {
                            if (tThere == Mark.ARROW) {
                                reversed++;
                            } else {
                                hits++;
                            }
                        }
                    }
                    kt++;
                    ke++;
                }
            }
        }
        return new EdgeCounts(p, new Adjacencies(truth.edgeCount(), estimate.edgeCount(), common, identical),
                new Endpoints(trueArrows, estArrows, correctArrows), new Endpoints(trueTails, estTails, correctTails),
                new DirectedCalls(hits, reversed));
    }

    /** Number of unordered pairs of variables, p(p − 1)/2. */
    public long pairs() {
        return (long) variables * (variables - 1) / 2;
    }

    /** Pairs adjacent in exactly one of the two graphs, or in both with some mark different. */
    public long differingPairs() {
        return edges.inTruth() + edges.inEstimate() - edges.common() - edges.identical();
    }

    /** Estimated edges on pairs the truth does not join. */
    public long extraEdges() {
        return edges.inEstimate() - edges.common();
    }

    /** {@code numerator / denominator}, or null (undefined) when the denominator is 0. */
    static Double ratio(long numerator, long denominator) {
        return denominator == 0 ? null : (double) numerator / denominator;
    }
}

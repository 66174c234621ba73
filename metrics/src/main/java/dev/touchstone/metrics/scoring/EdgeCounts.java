package dev.touchstone.metrics.scoring;

import dev.touchstone.core.graph.Graph;
import dev.touchstone.core.graph.Mark;

/**
 * The counts every structural metric is a ratio or sum of, gathered in one pass over the
 * edges of a truth and an estimate over the same variables in the same order.
 *
 * <p>Cost: O(p + E_truth + E_estimate) time, merging the two sorted adjacency rows of each
 * variable; no allocation beyond this record.
 *
 * @param variables        p, the number of variables
 * @param trueEdges        pairs adjacent in the truth
 * @param estimatedEdges   pairs adjacent in the estimate
 * @param commonEdges      pairs adjacent in both
 * @param identicalEdges   pairs adjacent in both with the same mark at each end
 * @param trueArrows       arrowhead endpoints in the truth
 * @param estimatedArrows  arrowhead endpoints in the estimate
 * @param correctArrows    estimated arrowheads at x on {x, y} where the truth has an edge on
 *                         {x, y} with an arrowhead at x
 * @param trueTails        tail endpoints in the truth
 * @param estimatedTails   tail endpoints in the estimate
 * @param correctTails     estimated tails matched by a true tail at the same end of the same pair
 * @param directedHits     estimated edges on true-adjacent pairs counted as true positives by the
 *                         rule of Zheng et al. (2018): a directed edge x → y whose truth has no
 *                         arrowhead at x, or an undirected edge (treated favourably)
 * @param directedReversed estimated directed edges x → y on true-adjacent pairs whose truth has an
 *                         arrowhead at x (reversed, or bidirected in a MAG truth)
 */
public record EdgeCounts(int variables, long trueEdges, long estimatedEdges, long commonEdges, long identicalEdges,
                         long trueArrows, long estimatedArrows, long correctArrows,
                         long trueTails, long estimatedTails, long correctTails,
                         long directedHits, long directedReversed) {

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
        return new EdgeCounts(p, truth.edgeCount(), estimate.edgeCount(), common, identical,
                trueArrows, estArrows, correctArrows, trueTails, estTails, correctTails, hits, reversed);
    }

    /** Number of unordered pairs of variables, p(p − 1)/2. */
    public long pairs() {
        return (long) variables * (variables - 1) / 2;
    }

    /** Pairs adjacent in exactly one of the two graphs, or in both with some mark different. */
    public long differingPairs() {
        return trueEdges + estimatedEdges - commonEdges - identicalEdges;
    }

    /** Estimated edges on pairs the truth does not join. */
    public long extraEdges() {
        return estimatedEdges - commonEdges;
    }

    /** {@code numerator / denominator}, or null (undefined) when the denominator is 0. */
    static Double ratio(long numerator, long denominator) {
        return denominator == 0 ? null : (double) numerator / denominator;
    }
}

package dev.touchstone.metrics.sid;

/**
 * The structural intervention distance of an estimate from a true DAG.
 *
 * @param sid   the distance when the estimate is a single DAG (no undirected edges); null for an
 *              estimate with undirected edges, which stands for several DAGs
 * @param lower the smallest count over the parent sets the estimate allows at each node
 *              (equal to {@code sid} for a DAG); no DAG of the estimate's class scores below it
 * @param upper the largest such count; no DAG of the class scores above it
 */
public record SidResult(Long sid, long lower, long upper) {

    public SidResult {
        if (lower < 0 || upper < lower || sid != null && (sid != lower || sid != upper)) {
            throw new IllegalArgumentException("inconsistent SID: sid=" + sid + ", lower=" + lower + ", upper=" + upper);
        }
    }
}

package dev.touchstone.metrics.scoring;

/**
 * {@code shd}: unordered pairs whose edge differs: present in one graph only, or present in both with some mark different; each pair counts once (Tsamardinos, Brown and Aliferis 2006)
 *
 * <p>Cost: O(1) from the shared {@link EdgeCounts}.
 */
public final class StructuralHammingDistance extends BaseMetric {

    /** The one instance. */
    public static final StructuralHammingDistance INSTANCE = new StructuralHammingDistance();

    private StructuralHammingDistance() {
        super("shd", Direction.LOWER_IS_BETTER, MetricRange.upTo("p(p−1)/2"), ALL,
                "unordered pairs whose edge differs: present in one graph only, or present in both with some mark different; each pair counts once (Tsamardinos, Brown and Aliferis 2006)");
    }

    @Override
    public Double value(GraphComparison c) {
        EdgeCounts n = c.counts();
        return (double) n.differingPairs();
    }
}

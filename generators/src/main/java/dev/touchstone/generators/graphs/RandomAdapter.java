package dev.touchstone.generators.graphs;

import org.apache.commons.rng.UniformRandomProvider;

import java.util.Random;

/**
 * A {@link Random} view of a Commons RNG source, so that JGraphT's generators (which take a
 * {@code java.util.Random}) draw from the caller's stream and stay deterministic in its seed.
 */
final class RandomAdapter extends Random {

    private static final long serialVersionUID = 1L;

    private final transient UniformRandomProvider source;

    RandomAdapter(UniformRandomProvider source) {
        this.source = source;
    }

    @Override
    protected int next(int bits) {
        return (int) (source.nextLong() >>> (64 - bits));
    }

    @Override
    public int nextInt() {
        return source.nextInt();
    }

    @Override
    public int nextInt(int bound) {
        return source.nextInt(bound);
    }

    @Override
    public long nextLong() {
        return source.nextLong();
    }

    @Override
    public double nextDouble() {
        return source.nextDouble();
    }

    @Override
    public boolean nextBoolean() {
        return source.nextBoolean();
    }
}

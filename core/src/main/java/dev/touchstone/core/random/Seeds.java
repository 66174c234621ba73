package dev.touchstone.core.random;

import org.apache.commons.rng.UniformRandomProvider;
import org.apache.commons.rng.simple.RandomSource;

import java.nio.charset.StandardCharsets;

/**
 * Derives independent seeds from a root seed and the coordinates of what they are for,
 * so that every random choice depends on what it is, never on the order of execution.
 *
 * <p>Parts are hashed with 64-bit FNV-1a over their UTF-8 bytes (with a separator), and
 * the result is mixed with the SplitMix64 finaliser (Steele, Lea and Flood 2014,
 * "Fast splittable pseudorandom number generators", OOPSLA). Both are fixed by their
 * definitions, so derived seeds are the same on every JVM and platform.
 */
public final class Seeds {

    private static final long FNV_OFFSET = 0xcbf29ce484222325L;
    private static final long FNV_PRIME = 0x100000001b3L;

    private Seeds() {
    }

    /** A seed for the thing at these coordinates under {@code root}. */
    public static long derive(long root, Object... parts) {
        long h = FNV_OFFSET;
        h = fnv(h, Long.toString(root));
        for (Object p : parts) {
            h = fnv(h, "\u0000");
            h = fnv(h, String.valueOf(p));
        }
        return mix(h);
    }

    /** The SplitMix64 finaliser: a bijection on 64-bit values with good avalanche. */
    public static long mix(long z) {
        z = (z ^ (z >>> 30)) * 0xbf58476d1ce4e5b9L;
        z = (z ^ (z >>> 27)) * 0x94d049bb133111ebL;
        return z ^ (z >>> 31);
    }

    /** A fast, well-tested generator (L64X128 mix) seeded with {@code seed}. */
    public static UniformRandomProvider random(long seed) {
        return RandomSource.L64_X128_MIX.create(seed);
    }

    private static long fnv(long h, String s) {
        for (byte b : s.getBytes(StandardCharsets.UTF_8)) {
            h ^= (b & 0xff);
            h *= FNV_PRIME;
        }
        return h;
    }
}

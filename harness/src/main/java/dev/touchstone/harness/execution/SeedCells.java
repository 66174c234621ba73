package dev.touchstone.harness.execution;

import java.util.List;

/**
 * How a 64-bit seed is written in the CSV tables so that every reader keeps it exactly. The
 * {@code seed} column holds the decimal value, exact for readers with 64-bit integers (Java,
 * pandas' int64, R's bit64). Readers that turn numbers into doubles (R's {@code read.csv},
 * spreadsheets) round integers beyond 2<sup>53</sup>, and derived seeds are spread over the
 * whole 64-bit range, so the same seed is also split into two halves that each fit a double
 * exactly: {@code seed_high}, the upper 32 bits as a signed integer, and {@code seed_low}, the
 * lower 32 bits as an unsigned integer (0 to 4294967295). The seed is
 * {@code seed_high * 2^32 + seed_low}, computed in 64-bit integers (for example
 * {@code bit64::as.integer64(seed_high) * 4294967296L + seed_low} in R).
 * Numbers kept as numbers keep the columns numeric, which a text or hexadecimal form would not.
 */
public final class SeedCells {

    /** The column of the upper 32 bits, signed. */
    public static final String HIGH = "seed_high";
    /** The column of the lower 32 bits, unsigned. */
    public static final String LOW = "seed_low";

    private SeedCells() {
    }

    /** The cells {@code seed}, {@code seed_high}, {@code seed_low} of one seed. */
    public static List<String> cells(long seed) {
        return List.of(Long.toString(seed), Integer.toString(high(seed)), Long.toString(low(seed)));
    }

    /** The upper 32 bits of a seed, signed. */
    public static int high(long seed) {
        return (int) (seed >> 32);
    }

    /** The lower 32 bits of a seed, unsigned. */
    public static long low(long seed) {
        return seed & 0xFFFF_FFFFL;
    }

    /** The seed put back together from its halves. */
    public static long join(long high, long low) {
        if (high < Integer.MIN_VALUE || high > Integer.MAX_VALUE || low < 0 || low > 0xFFFF_FFFFL) {
            throw new IllegalArgumentException("seed halves out of range: " + high + ", " + low);
        }
        return (high << 32) | low;
    }
}

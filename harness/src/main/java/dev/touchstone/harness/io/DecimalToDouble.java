package dev.touchstone.harness.io;

import java.lang.invoke.MethodHandles;
import java.lang.invoke.VarHandle;
import java.math.BigInteger;
import java.nio.ByteOrder;
import java.nio.charset.StandardCharsets;

/**
 * Reads a decimal number written in bytes as the nearest double, exactly as
 * {@link Double#parseDouble} would, without making a String for the common cases.
 *
 * <p>The grammar is that of a data file's numbers,
 * {@code [+-]?(digits[.digits]|.digits)([eE][+-]?digits)?}; anything else returns NaN,
 * which no number of that grammar parses to. Three paths, each exact:
 * <ol>
 * <li>A significand of at most 2<sup>53</sup> with a power of ten 10<sup>q</sup>,
 *     |q| &le; 22: both are exact doubles, so one multiplication or division is correctly
 *     rounded (Clinger 1990, "How to read floating point numbers accurately", PLDI).</li>
 * <li>Otherwise, with at most 19 significant digits, the significand w is multiplied by a
 *     128-bit truncation T of 5<sup>q</sup> (the power of two of 10<sup>q</sup> is exact).
 *     The idea of a wide product with a truncated power of five is Lemire's ("Number parsing
 *     at a gigabyte per second", Software: Practice and Experience 51(8), 2021); the bound
 *     used here is our own and simpler: with 5<sup>q</sup> in [T, T+1)·2<sup>e</sup>, the
 *     exact product lies in [w·T, w·T + 2<sup>64</sup>), and w·T is computed exactly in 192
 *     bits. When every value of that interval rounds to the same 53-bit significand, that
 *     significand is the correctly rounded result.</li>
 * <li>Everything else (more than 19 significant digits, a result that is subnormal or
 *     overflows, exponents outside the table, and the about one in 300 products whose
 *     interval straddles a rounding boundary) goes to {@link Double#parseDouble}.</li>
 * </ol>
 * Cost: a pass over the bytes and four 64-bit multiplications; the table of powers takes
 * 651 × 20 bytes, built once from exact integers.
 */
final class DecimalToDouble {

    private static final int Q_MIN = -342;
    private static final int Q_MAX = 308;
    private static final long[] T_HI = new long[Q_MAX - Q_MIN + 1];
    private static final long[] T_LO = new long[Q_MAX - Q_MIN + 1];
    private static final int[] T_EXP = new int[Q_MAX - Q_MIN + 1];
    private static final double[] EXACT_POWERS = {
        1e0, 1e1, 1e2, 1e3, 1e4, 1e5, 1e6, 1e7, 1e8, 1e9, 1e10, 1e11,
        1e12, 1e13, 1e14, 1e15, 1e16, 1e17, 1e18, 1e19, 1e20, 1e21, 1e22};
    private static final long TWO_53 = 1L << 53;
    private static final VarHandle LITTLE_ENDIAN_LONG =
            MethodHandles.byteArrayViewVarHandle(long[].class, ByteOrder.LITTLE_ENDIAN);
    private static final BigInteger MASK_64 = BigInteger.ONE.shiftLeft(64).subtract(BigInteger.ONE);

    static {
        BigInteger five = BigInteger.valueOf(5);
        for (int q = Q_MIN; q <= Q_MAX; q++) {
            BigInteger t;
            int e;
            if (q >= 0) {
                BigInteger v = five.pow(q);
                int s = v.bitLength();
                t = s <= 128 ? v.shiftLeft(128 - s) : v.shiftRight(s - 128);
                e = s - 128;
            } else {
                // 2^k / 5^-q lies in (2^127, 2^128) for k = 127 + bitLength(5^-q); floor it.
                BigInteger d = five.pow(-q);
                int k = 127 + d.bitLength();
                t = BigInteger.ONE.shiftLeft(k).divide(d);
                e = -k;
            }
            T_HI[q - Q_MIN] = t.shiftRight(64).longValue();
            T_LO[q - Q_MIN] = t.and(MASK_64).longValue();
            T_EXP[q - Q_MIN] = e;
        }
    }

    private DecimalToDouble() {
    }

    /**
     * The double nearest to the number in {@code b[from, to)}, or NaN if the bytes are not a
     * number of the grammar above. Returns ±infinity for numbers too large for a double.
     */
    static double parse(byte[] b, int from, int to) {
        int i = from;
        boolean negative = false;
        if (i < to && (b[i] == '+' || b[i] == '-')) {
            negative = b[i] == '-';
            i++;
        }
        long w = 0; // unsigned: 19 digits may exceed Long.MAX_VALUE
        int significant = 0;
        boolean truncated = false;
        long scale = 0;
        int intStart = i;
        while (i < to && b[i] == '0') {
            i++;
        }
        while (significant <= 11 && i + 8 <= to && isEightDigits(b, i)) {
            w = w * 100_000_000L + eightDigits(b, i);
            significant += w == 0 ? 0 : 8;
            i += 8;
        }
        while (i < to && isDigit(b[i])) {
            if (significant < 19) {
                w = w * 10 + (b[i] - '0');
                significant += w == 0 ? 0 : 1;
            } else {
                truncated = true;
                scale++;
            }
            i++;
        }
        int intDigits = i - intStart;
        int fracDigits = 0;
        if (i < to && b[i] == '.') {
            i++;
            int fracStart = i;
            if (w == 0) {
                while (i < to && b[i] == '0') {
                    i++;
                    scale--;
                }
            }
            while (significant <= 11 && i + 8 <= to && isEightDigits(b, i)) {
                w = w * 100_000_000L + eightDigits(b, i);
                significant += 8;
                scale -= 8;
                i += 8;
            }
            while (i < to && isDigit(b[i])) {
                if (significant < 19) {
                    w = w * 10 + (b[i] - '0');
                    significant += w == 0 ? 0 : 1;
                    scale--;
                } else {
                    truncated = true;
                }
                i++;
            }
            fracDigits = i - fracStart;
        }
        if (intDigits == 0 && fracDigits == 0) {
            return Double.NaN;
        }
        long exponent = 0;
        if (i < to && (b[i] == 'e' || b[i] == 'E')) {
            i++;
            boolean negativeExponent = false;
            if (i < to && (b[i] == '+' || b[i] == '-')) {
                negativeExponent = b[i] == '-';
                i++;
            }
            int expStart = i;
            while (i < to && isDigit(b[i])) {
                if (exponent < 100_000_000L) {
                    exponent = exponent * 10 + (b[i] - '0');
                }
                i++;
            }
            if (i == expStart) {
                return Double.NaN;
            }
            exponent = negativeExponent ? -exponent : exponent;
        }
        if (i != to) {
            return Double.NaN;
        }
        if (w == 0 && !truncated) {
            return negative ? -0.0 : 0.0;
        }
        long q = scale + exponent;
        if (!truncated) {
            if (w >= 0 && w <= TWO_53 && q >= -22 && q <= 22) {
                double v = q >= 0 ? (double) w * EXACT_POWERS[(int) q] : (double) w / EXACT_POWERS[(int) -q];
                return negative ? -v : v;
            }
            if (q >= Q_MIN && q <= Q_MAX) {
                long bits = wideProduct(w, (int) q);
                if (bits != -1L) {
                    return Double.longBitsToDouble(negative ? bits | Long.MIN_VALUE : bits);
                }
            }
        }
        return Double.parseDouble(new String(b, from, to - from, StandardCharsets.ISO_8859_1));
    }

    /** Whether the eight bytes from {@code i} are all ASCII digits (every byte in 0x30..0x39). */
    private static boolean isEightDigits(byte[] b, int i) {
        long v = (long) LITTLE_ENDIAN_LONG.get(b, i);
        return ((v & 0xF0F0F0F0F0F0F0F0L) | (((v + 0x0606060606060606L) & 0xF0F0F0F0F0F0F0F0L) >>> 4))
                == 0x3333333333333333L;
    }

    /**
     * The value of eight ASCII digits read as one little-endian long: pairs, then quads, then
     * the whole, combined by multiplication (the SWAR method of Lemire's paper above).
     */
    private static long eightDigits(byte[] b, int i) {
        long v = (long) LITTLE_ENDIAN_LONG.get(b, i) - 0x3030303030303030L;
        v = v * 10 + (v >>> 8);
        v = ((v & 0x000000FF000000FFL) * (100 + (1_000_000L << 32))
                + ((v >>> 16) & 0x000000FF000000FFL) * (1 + (10_000L << 32))) >>> 32;
        return v;
    }

    private static boolean isDigit(byte c) {
        return c >= '0' && c <= '9';
    }

    /**
     * The bits of the positive double nearest to w·10<sup>q</sup> (w &gt; 0, below
     * 10<sup>19</sup>), or −1 when the 192-bit bound cannot decide the rounding or the result
     * is not a normal double.
     */
    private static long wideProduct(long w, int q) {
        int lz = Long.numberOfLeadingZeros(w);
        long m = w << lz;
        long tHi = T_HI[q - Q_MIN];
        long tLo = T_LO[q - Q_MIN];
        long aHi = unsignedMultiplyHigh(m, tLo);
        long bLo = m * tHi;
        long bHi = unsignedMultiplyHigh(m, tHi);
        long mid = bLo + aHi;
        long top = bHi + (Long.compareUnsigned(mid, bLo) < 0 ? 1 : 0);
        // The product P = top·2^128 + mid·2^64 + low lies in [2^190, 2^192); the exact value
        // X lies in [P, P + 2^64), so only the low word and a carry into mid are uncertain.
        int sh = top < 0 ? 11 : 10;
        long significand = top >>> sh;
        long rest = top & ((1L << sh) - 1);
        long half = 1L << (sh - 1);
        long full = 1L << sh;
        boolean up;
        if (rest < half - 1 || (rest == half - 1 && mid != -1L)) {
            up = false;
        } else if ((rest > half || (rest == half && mid != 0)) && (rest < full - 1 || (rest == full - 1 && mid != -1L))) {
            up = true;
        } else {
            return -1L;
        }
        long e2 = 128L + sh + T_EXP[q - Q_MIN] + q - lz;
        if (up) {
            significand++;
            if (significand == TWO_53) {
                significand = TWO_53 >>> 1;
                e2++;
            }
        }
        long biased = e2 + 52 + 1023;
        if (biased <= 0 || biased >= 2047) {
            return -1L;
        }
        return (biased << 52) | (significand & ((1L << 52) - 1));
    }

    /** The high 64 bits of the unsigned 128-bit product (Java 17 has only the signed one). */
    private static long unsignedMultiplyHigh(long a, long b) {
        return Math.multiplyHigh(a, b) + ((a >> 63) & b) + ((b >> 63) & a);
    }
}

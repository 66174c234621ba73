package dev.touchstone.harness.io;

import java.math.BigInteger;
import java.nio.charset.StandardCharsets;

/**
 * Writes a finite double as the shortest decimal that reads back to the same double, and of
 * the shortest ones the closest to it (ties to an even last digit). The digits come from
 * Giulietti's Schubfach method ("The Schubfach way to render doubles", 2020, rev. 2021): the
 * double's rounding interval is scaled by a 126-bit approximation of a power of ten chosen so
 * that the interval holds at most one multiple of ten and at least one integer, and each end
 * is rounded with a sticky bit, so a few 64-bit multiplications decide exactly which
 * candidate lies inside the interval. Written here from the paper.
 *
 * <p>The text: plain decimal when the leading digit's power of ten is between −3 and 15
 * ({@code 0.00123}, {@code 42}, {@code -1.5}), else scientific ({@code 1.25e-7},
 * {@code 6.02e23}); {@code -0} for negative zero. Every form matches the data reader's number
 * grammar. Cost: constant per value; the table of powers holds 617 × 16 bytes.
 */
final class ShortestDecimal {

    private static final int K_MIN = -324;
    private static final int K_MAX = 292;
    private static final long[] G1 = new long[K_MAX - K_MIN + 1];
    private static final long[] G0 = new long[K_MAX - K_MIN + 1];
    private static final long MASK_63 = (1L << 63) - 1;
    private static final int Q_MIN = -1074;
    private static final long C_MIN = 1L << 52;
    /** Room enough for any value: sign, 17 digits, point or "0.000", "e-", three exponent digits. */
    static final int MAX_CHARS = 32;

    static {
        // g = floor(10^-k · 2^-r) + 1 with r chosen so that 2^125 <= g < 2^126.
        for (int k = K_MIN; k <= K_MAX; k++) {
            int e = -k;
            int r = floorLog2Pow10(e) - 125;
            BigInteger g;
            if (e >= 0) {
                BigInteger p = BigInteger.TEN.pow(e);
                g = r >= 0 ? p.shiftRight(r) : p.shiftLeft(-r);
            } else {
                g = BigInteger.ONE.shiftLeft(-r).divide(BigInteger.TEN.pow(-e));
            }
            g = g.add(BigInteger.ONE);
            G1[k - K_MIN] = g.shiftRight(63).longValue();
            G0[k - K_MIN] = g.longValue() & MASK_63;
        }
    }

    private ShortestDecimal() {
    }

    /** ⌊e · log10 2⌋ for |e| ≤ 5456 (a fixed-point product; checked against exact powers in the tests). */
    static int floorLog10Pow2(int e) {
        return (int) ((e * 661_971_961_083L) >> 41);
    }

    /** ⌊log10(3/4 · 2^e)⌋ for |e| ≤ 5456. */
    static int floorLog10ThreeQuartersPow2(int e) {
        return (int) ((e * 661_971_961_083L - 274_743_187_321L) >> 41);
    }

    /** ⌊e · log2 10⌋ for |e| ≤ 1650. */
    static int floorLog2Pow10(int e) {
        return (int) ((e * 913_124_641_741L) >> 38);
    }

    /** The text of {@code v} as a String (see {@link #write}). */
    static String toString(double v) {
        byte[] out = new byte[MAX_CHARS];
        return new String(out, 0, write(v, out, 0), StandardCharsets.ISO_8859_1);
    }

    /**
     * Writes {@code v} as ASCII bytes into {@code out} from {@code at}; returns the position after it.
     *
     * @throws IllegalArgumentException for NaN or an infinity, which a data file cannot hold
     */
    static int write(double v, byte[] out, int at) {
        long bits = Double.doubleToRawLongBits(v);
        int bq = (int) (bits >>> 52) & 0x7FF;
        long t = bits & ((1L << 52) - 1);
        if (bq == 0x7FF) {
            throw new IllegalArgumentException("cannot write " + v + " as a finite decimal");
        }
        int i = at;
        if (bits < 0) {
            out[i++] = '-';
        }
        if (bq == 0 && t == 0) {
            out[i++] = '0';
            return i;
        }
        if (bq != 0) {
            int q = bq - 1075;
            long c = C_MIN | t;
            if (q < 0 && q > -53 && (c & ((1L << -q) - 1)) == 0) {
                // A whole number below 2^53: its digits are exact and no shorter decimal is nearer.
                return chars(c >> -q, 0, out, i);
            }
            return decimal(q, c, out, i);
        }
        return decimal(Q_MIN, t, out, i);
    }

    /**
     * Writes the shortest, then nearest, decimal f·10^e in the rounding interval of c·2^q
     * (the interval's ends belong to it when c is even, as round-half-even reads them back).
     */
    private static int decimal(int q, long c, byte[] chars, int at) {
        int out = (int) c & 1;
        long cb = c << 2;
        long cbr = cb + 2;
        long cbl;
        int k;
        // The interval is asymmetric at a power of two: the next double below is half as far.
        if (c != C_MIN || q == Q_MIN) {
            cbl = cb - 2;
            k = floorLog10Pow2(q);
        } else {
            cbl = cb - 1;
            k = floorLog10ThreeQuartersPow2(q);
        }
        int h = q + floorLog2Pow10(-k) + 2;
        long g1 = G1[k - K_MIN];
        long g0 = G0[k - K_MIN];
        long vb = roundOdd(g1, g0, cb << h);
        long vbl = roundOdd(g1, g0, cbl << h);
        long vbr = roundOdd(g1, g0, cbr << h);
        long s = vb >> 2;
        if (s >= 10) {
            // One digit fewer: the multiples of ten just below and above. (The paper asks for
            // s >= 100 because Java's toString wants two digits at least; we want the shortest.)
            long sp10 = 10 * Math.multiplyHigh(s, 115_292_150_460_684_698L << 4);
            long tp10 = sp10 + 10;
            boolean upin = vbl + out <= sp10 << 2;
            boolean wpin = (tp10 << 2) + out <= vbr;
            if (upin != wpin) {
                return chars(upin ? sp10 : tp10, k, chars, at);
            }
        }
        long tt = s + 1;
        boolean uin = vbl + out <= s << 2;
        boolean win = (tt << 2) + out <= vbr;
        if (uin != win) {
            return chars(uin ? s : tt, k, chars, at);
        }
        long cmp = vb - ((s + tt) << 1);
        return chars(cmp < 0 || (cmp == 0 && (s & 1) == 0) ? s : tt, k, chars, at);
    }

    /**
     * ⌊g · cp / 2^127⌋ with its lowest bit set when the discarded part is not zero ("round to
     * odd"), g = g1·2^63 + g0.
     */
    private static long roundOdd(long g1, long g0, long cp) {
        long x1 = Math.multiplyHigh(g0, cp);
        long y0 = g1 * cp;
        long y1 = Math.multiplyHigh(g1, cp);
        long z = (y0 >>> 1) + x1;
        long vbp = y1 + (z >>> 63);
        return vbp | (((z & MASK_63) + MASK_63) >>> 63);
    }

    /**
     * Writes f·10^e (f &gt; 0) without trailing zeros in the digits, plain or scientific. The
     * digits are written straight into their places, two at a time from a table, with one
     * division by 10^8 per eight digits, instead of one division per digit.
     */
    private static int chars(long f, int e, byte[] out, int at) {
        while (f % 10 == 0) {
            f /= 10;
            e++;
        }
        int n = digitCount(f);
        // lead is the power of ten of the leading digit.
        int lead = e + n - 1;
        int i = at;
        if (lead >= -3 && lead <= 15) {
            if (lead < 0) {
                out[i++] = '0';
                out[i++] = '.';
                for (int z = -1; z > lead; z--) {
                    out[i++] = '0';
                }
                putDigits(f, out, i + n);
                return i + n;
            }
            if (n > lead + 1) {
                // The integer part's digits, the point, then the fraction's: written whole,
                // then the fraction moved one place right to make room for the point.
                putDigits(f, out, i + n);
                int point = i + lead + 1;
                System.arraycopy(out, point, out, point + 1, i + n - point);
                out[point] = '.';
                return i + n + 1;
            }
            putDigits(f, out, i + n);
            i += n;
            for (int z = 0; z < e; z++) {
                out[i++] = '0';
            }
            return i;
        }
        putDigits(f, out, i + 1 + n);
        out[i] = out[i + 1];
        if (n > 1) {
            out[i + 1] = '.';
            i += n + 1;
        } else {
            i += 1;
        }
        out[i++] = 'e';
        int x = lead;
        if (x < 0) {
            out[i++] = '-';
            x = -x;
        }
        if (x >= 100) {
            out[i++] = (byte) ('0' + x / 100);
        }
        if (x >= 10) {
            out[i++] = (byte) ('0' + x / 10 % 10);
        }
        out[i++] = (byte) ('0' + x % 10);
        return i;
    }

    private static final long[] POW10 = new long[19];
    private static final byte[] PAIRS = new byte[200];

    static {
        POW10[0] = 1;
        for (int k = 1; k < POW10.length; k++) {
            POW10[k] = POW10[k - 1] * 10;
        }
        for (int k = 0; k < 100; k++) {
            PAIRS[2 * k] = (byte) ('0' + k / 10);
            PAIRS[2 * k + 1] = (byte) ('0' + k % 10);
        }
    }

    /** The number of decimal digits of f, 0 &lt; f &lt; 10^18: ⌊log10 f⌋ + 1 from the bit length (1233/4096 ≈ log10 2). */
    private static int digitCount(long f) {
        int t = ((64 - Long.numberOfLeadingZeros(f)) * 1233) >>> 12;
        return f >= POW10[t] ? t + 1 : t;
    }

    /** Writes the digits of f (&gt; 0) so that the last one is at {@code end - 1}. */
    private static void putDigits(long f, byte[] out, int end) {
        int i = end;
        while (f >= 100_000_000L) {
            long q = f / 100_000_000L;
            int r = (int) (f - q * 100_000_000L);
            f = q;
            for (int k = 0; k < 4; k++) {
                int r2 = r / 100;
                int pair = (r - r2 * 100) << 1;
                out[--i] = PAIRS[pair + 1];
                out[--i] = PAIRS[pair];
                r = r2;
            }
        }
        int x = (int) f;
        while (x >= 100) {
            int x2 = x / 100;
            int pair = (x - x2 * 100) << 1;
            out[--i] = PAIRS[pair + 1];
            out[--i] = PAIRS[pair];
            x = x2;
        }
        if (x >= 10) {
            out[--i] = PAIRS[(x << 1) + 1];
            out[--i] = PAIRS[x << 1];
        } else {
            out[--i] = (byte) ('0' + x);
        }
    }
}

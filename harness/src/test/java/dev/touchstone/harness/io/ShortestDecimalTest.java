package dev.touchstone.harness.io;

import dev.touchstone.core.random.Seeds;

import org.apache.commons.rng.UniformRandomProvider;
import org.junit.jupiter.api.Test;

import java.math.BigDecimal;
import java.math.BigInteger;
import java.math.MathContext;
import java.math.RoundingMode;
import java.nio.charset.StandardCharsets;
import java.util.regex.Pattern;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

/**
 * Checks of the shortest-decimal writer against exact arithmetic: {@link Double#parseDouble}
 * (correctly rounded by the Java SE specification) for the round trip, and
 * {@link BigDecimal} for shortness and nearness (the two properties Steele and White 1990 and
 * Giulietti 2020 ask of a shortest rendering): no decimal with fewer digits reads back to the
 * double, and of those with as many digits the one written is the nearest.
 */
class ShortestDecimalTest {

    private static final Pattern GRAMMAR = Pattern.compile("[+-]?(?:\\d+(?:\\.\\d*)?|\\.\\d+)(?:[eE][+-]?\\d+)?");

    /** Fails unless {@code v}'s text reads back to it, is shortest, and is nearest among the shortest. */
    private static void check(double v) {
        String s = ShortestDecimal.toString(v);
        assertTrue(GRAMMAR.matcher(s).matches(), s);
        assertEquals(Double.doubleToRawLongBits(v), Double.doubleToRawLongBits(Double.parseDouble(s)), s);
        byte[] b = s.getBytes(StandardCharsets.ISO_8859_1);
        assertEquals(Double.doubleToRawLongBits(v), Double.doubleToRawLongBits(DecimalToDouble.parse(b, 0, b.length)), s);
        if (v == 0) {
            return;
        }
        double a = Math.abs(v);
        BigDecimal exact = new BigDecimal(a);
        BigDecimal mine = new BigDecimal(s).abs();
        int digits = mine.stripTrailingZeros().precision();
        for (int d = 1; d < digits; d++) {
            // The d-digit decimals nearest below and above the double; if neither reads back,
            // none does, since the doubles' rounding intervals are intervals.
            BigDecimal lo = exact.round(new MathContext(d, RoundingMode.FLOOR));
            BigDecimal hi = exact.round(new MathContext(d, RoundingMode.CEILING));
            assertTrue(Double.parseDouble(lo.toString()) != a && Double.parseDouble(hi.toString()) != a,
                    () -> s + " is not shortest: " + lo + " or " + hi + " reads back too");
        }
        BigDecimal lo = exact.round(new MathContext(digits, RoundingMode.FLOOR));
        BigDecimal hi = exact.round(new MathContext(digits, RoundingMode.CEILING));
        boolean loIn = Double.parseDouble(lo.toString()) == a;
        boolean hiIn = Double.parseDouble(hi.toString()) == a;
        int cmp = exact.subtract(lo).compareTo(hi.subtract(exact));
        BigDecimal nearest = loIn && hiIn ? (cmp < 0 ? lo : cmp > 0 ? hi : null) : loIn ? lo : hi;
        if (nearest != null) {
            assertEquals(0, mine.compareTo(nearest), () -> s + " is not the nearest shortest decimal " + nearest);
        }
    }

    @Test
    void randomDoublesAreShortestNearestAndReadBack() {
        UniformRandomProvider rng = Seeds.random(2204);
        for (int i = 0; i < 6_000; i++) {
            double v;
            switch (i % 5) {
                case 0:
                    v = Double.longBitsToDouble(rng.nextLong());
                    break;
                case 1:
                    v = Double.longBitsToDouble(rng.nextLong() & 0x800FFFFFFFFFFFFFL); // subnormals
                    break;
                case 2:
                    v = Math.scalb(1.0, rng.nextInt(2098) - 1074); // powers of two: lopsided intervals
                    break;
                case 3:
                    v = Math.rint((rng.nextDouble() - 0.5) * 2e7) / 1000;
                    break;
                default:
                    v = (rng.nextDouble() - 0.5) * Math.pow(10, rng.nextInt(40) - 20);
                    break;
            }
            if (Double.isFinite(v)) {
                check(v);
            }
        }
    }

    @Test
    void theSmallestSubnormalsAndKnownValues() {
        for (long t = 1; t < 300; t++) {
            check(Double.longBitsToDouble(t));
        }
        // Values from memory where a non-shortest printer goes wrong: 2e23 and 1e23 sit next to
        // powers of two, 5e-324 is the smallest double, 0.1 + 0.2 needs all 17 digits.
        assertEquals("5e-324", ShortestDecimal.toString(Double.MIN_VALUE));
        assertEquals("1e-323", ShortestDecimal.toString(2 * Double.MIN_VALUE));
        assertEquals("1e23", ShortestDecimal.toString(1e23));
        assertEquals("2e23", ShortestDecimal.toString(2e23));
        assertEquals("0.30000000000000004", ShortestDecimal.toString(0.1 + 0.2));
        assertEquals("1.7976931348623157e308", ShortestDecimal.toString(Double.MAX_VALUE));
        assertEquals("2.2250738585072014e-308", ShortestDecimal.toString(Double.MIN_NORMAL));
        assertEquals("-0", ShortestDecimal.toString(-0.0));
        assertEquals("0", ShortestDecimal.toString(0.0));
        assertEquals("0.001", ShortestDecimal.toString(0.001));
        assertEquals("1.5e-4", ShortestDecimal.toString(1.5e-4));
        assertEquals("1000000000000000", ShortestDecimal.toString(1e15));
        assertEquals("1e16", ShortestDecimal.toString(1e16));
        assertEquals("-1234.5", ShortestDecimal.toString(-1234.5));
        assertThrows(IllegalArgumentException.class, () -> ShortestDecimal.toString(Double.NaN));
        assertThrows(IllegalArgumentException.class, () -> ShortestDecimal.toString(Double.NEGATIVE_INFINITY));
    }

    @Test
    void fixedPointLogarithmsAreExactFloorsOverTheirRange() {
        // floor(e log10 2) is the largest k with 10^k <= 2^e; likewise for the others (exact integers).
        for (int e = -1100; e <= 1100; e++) {
            assertEquals(floorLog(BigInteger.TWO, e, BigInteger.TEN, BigInteger.ONE), ShortestDecimal.floorLog10Pow2(e), "log10 2^" + e);
            // 3/4 · 2^e = 3 · 2^(e-2)
            assertEquals(floorLog(BigInteger.TWO, e - 2, BigInteger.TEN, BigInteger.valueOf(3)),
                    ShortestDecimal.floorLog10ThreeQuartersPow2(e), "log10 3/4 2^" + e);
        }
        for (int e = -350; e <= 350; e++) {
            assertEquals(floorLog(BigInteger.TEN, e, BigInteger.TWO, BigInteger.ONE), ShortestDecimal.floorLog2Pow10(e), "log2 10^" + e);
        }
    }

    /** The largest k with base^k <= m · x^e, by exact integer comparison. */
    private static int floorLog(BigInteger x, int e, BigInteger base, BigInteger m) {
        // Compare base^k with m · x^e as fractions with positive powers on both sides.
        int k = (int) Math.floor(e * Math.log(x.doubleValue()) / Math.log(base.doubleValue())) - 2;
        while (lessOrEqual(base, k + 1, m, x, e)) {
            k++;
        }
        while (!lessOrEqual(base, k, m, x, e)) {
            k--;
        }
        return k;
    }

    /** Whether base^k <= m · x^e. */
    private static boolean lessOrEqual(BigInteger base, int k, BigInteger m, BigInteger x, int e) {
        BigInteger left = k >= 0 ? base.pow(k) : BigInteger.ONE;
        BigInteger right = m;
        if (k < 0) {
            right = right.multiply(base.pow(-k));
        }
        if (e >= 0) {
            right = right.multiply(x.pow(e));
        } else {
            left = left.multiply(x.pow(-e));
        }
        return left.compareTo(right) <= 0;
    }
}

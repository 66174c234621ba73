package dev.touchstone.harness.io;

import dev.touchstone.core.random.Seeds;

import org.apache.commons.rng.UniformRandomProvider;
import org.junit.jupiter.api.Test;

import java.math.BigDecimal;
import java.math.MathContext;
import java.nio.charset.StandardCharsets;
import java.util.List;
import java.util.Locale;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

/**
 * The reference for every value is {@link Double#parseDouble}, which the Java SE
 * specification requires to round correctly to the nearest double (Double.valueOf's
 * contract); the parser must agree with it bit for bit.
 */
class DecimalToDoubleTest {

    private static double parse(String s) {
        byte[] b = s.getBytes(StandardCharsets.ISO_8859_1);
        return DecimalToDouble.parse(b, 0, b.length);
    }

    private static void agrees(String s) {
        assertEquals(Double.doubleToRawLongBits(Double.parseDouble(s)), Double.doubleToRawLongBits(parse(s)), s);
    }

    /** A double drawn to cover every range: any bit pattern, subnormals, ±0, integers, small decimals. */
    private static double draw(UniformRandomProvider rng, int kind) {
        switch (kind) {
            case 0:
                return Double.longBitsToDouble(rng.nextLong());
            case 1:
                return Double.longBitsToDouble(rng.nextLong() & 0x800FFFFFFFFFFFFFL);
            case 2:
                return rng.nextBoolean() ? 0.0 : -0.0;
            case 3:
                return (double) (rng.nextLong() >> rng.nextInt(64));
            case 4:
                return Math.rint(rng.nextDouble() * 2e6 - 1e6) / 1000;
            default:
                return (rng.nextDouble() - 0.5) * Math.pow(10, rng.nextInt(80) - 40);
        }
    }

    /** The text of {@code v} in one of several spellings: Java's, C's %.17g, 1 to 30 digits, plain. */
    private static String spell(UniformRandomProvider rng, double v) {
        switch (rng.nextInt(5)) {
            case 0:
                return Double.toString(v);
            case 1:
                return String.format(Locale.ROOT, "%.17g", v).replace(" ", "");
            case 2:
                return new BigDecimal(v).round(new MathContext(1 + rng.nextInt(30))).toString();
            case 3:
                return new BigDecimal(v).round(new MathContext(1 + rng.nextInt(20))).toPlainString();
            default:
                // Exact decimal expansion: up to ~770 digits for subnormals (long mantissas).
                return new BigDecimal(v).toString();
        }
    }

    @Test
    void agreesWithParseDoubleOnRandomDoublesInManySpellings() {
        UniformRandomProvider rng = Seeds.random(2201);
        int checked = 0;
        for (int i = 0; i < 110_000; i++) {
            double v = draw(rng, i % 6);
            if (!Double.isFinite(v)) {
                continue;
            }
            agrees(spell(rng, v));
            checked++;
        }
        assertTrue(checked >= 100_000, "enough finite values drawn: " + checked);
    }

    @Test
    void agreesOnRandomDigitStringsAndExponents() {
        // Arbitrary decimal strings, not spellings of doubles: midpoints and near-midpoints of
        // doubles are hit by long digit strings, and exponents range to under- and overflow.
        UniformRandomProvider rng = Seeds.random(2202);
        for (int i = 0; i < 30_000; i++) {
            StringBuilder sb = new StringBuilder();
            if (rng.nextInt(3) == 0) {
                sb.append(rng.nextBoolean() ? '-' : '+');
            }
            int digits = 1 + rng.nextInt(rng.nextBoolean() ? 19 : 40);
            int point = rng.nextInt(digits + 1);
            for (int d = 0; d < digits; d++) {
                if (d == point) {
                    sb.append('.');
                }
                sb.append((char) ('0' + rng.nextInt(10)));
            }
            if (rng.nextBoolean()) {
                sb.append(rng.nextBoolean() ? 'e' : 'E').append(rng.nextInt(700) - 350);
            }
            String s = sb.toString();
            if (s.endsWith(".") && rng.nextBoolean()) {
                s = s + "0";
            }
            agrees(s);
        }
    }

    @Test
    void boundaryValuesAgree() {
        // Extremes of the double format (IEEE 754-2008) and known hard cases for correct
        // rounding: 2^53 + 1 is a midpoint, 2.2250738585072011e-308 lies just below the
        // smallest normal (the input that hung Java's parser in 2011, from memory).
        List<String> cases = List.of("0", "-0", "0.0", "-0.000", "+0e10", "1", "-1", "1.", ".5", "0.1",
                "0.30000000000000004", "9007199254740992", "9007199254740993", "9007199254740995",
                "18446744073709551615", "9999999999999999999", "99999999999999999999",
                "4.9e-324", "2.4703282292062327e-324", "2.4703282292062328e-324", "5e-324",
                "2.2250738585072011e-308", "2.2250738585072014e-308", "1.7976931348623157e308",
                "1.7976931348623158e308", "1e23", "8.41e21", "1e-400", "123e-2", "000123.4500e+002",
                "1e0000000000000000000001");
        for (String s : cases) {
            agrees(s);
        }
        assertEquals(Double.POSITIVE_INFINITY, parse("1e400"));
        assertEquals(Double.NEGATIVE_INFINITY, parse("-1.8e308"));
    }

    @Test
    void textOutsideTheDataFileGrammarIsNotANumber() {
        // Double.parseDouble accepts all of these but a data file's number grammar does not.
        for (String s : List.of("", "+", "-", ".", "e5", "1e", "1e+", "1d", "1f", "0x1p3", "NaN", "Infinity",
                " 1", "1 ", "1.2.3", "1e2.5", "--1", "1_000")) {
            assertTrue(Double.isNaN(parse(s)), s);
        }
    }
}

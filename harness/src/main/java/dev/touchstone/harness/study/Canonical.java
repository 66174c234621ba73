package dev.touchstone.harness.study;

import dev.touchstone.harness.io.Sha256;

/** The one way values are written into canonical texts and hashed into keys, so keys are stable across runs and machines. */
public final class Canonical {

    private Canonical() {
    }

    /** A value as canonical text: integers plainly, reals by {@link Double#toString}, words as they are. */
    public static String value(Object v) {
        if (v instanceof Double) {
            double d = (Double) v;
            return Double.toString(d == 0.0 ? 0.0 : d);
        }
        return String.valueOf(v);
    }

    /** The first 16 hex digits of the SHA-256 of the text (64 bits: collisions need ~4 billion runs). */
    public static String hash(String text) {
        return Sha256.hex(text, 8);
    }
}

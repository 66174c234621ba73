package dev.touchstone.harness.study;

import java.nio.charset.StandardCharsets;
import java.security.MessageDigest;
import java.security.NoSuchAlgorithmException;
import java.util.HexFormat;

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
        try {
            byte[] h = MessageDigest.getInstance("SHA-256").digest(text.getBytes(StandardCharsets.UTF_8));
            return HexFormat.of().formatHex(h, 0, 8);
        } catch (NoSuchAlgorithmException e) {
            throw new IllegalStateException("SHA-256 is part of every Java platform", e);
        }
    }
}

package dev.touchstone.harness.io;

import java.io.IOException;
import java.io.InputStream;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.security.MessageDigest;
import java.security.NoSuchAlgorithmException;
import java.util.HexFormat;

/**
 * The harness's one SHA-256 (FIPS 180-4) helper: run keys, plan and study hashes, digests of
 * given graph files, command versions and the finished marker's file digests all come from
 * here, in lower-case hex, whole or cut to a prefix of bytes. One digest in progress, fed with
 * texts (UTF-8), bytes and files; not thread-safe (each caller makes its own). Cost: one pass
 * over what is fed.
 */
public final class Sha256 {

    private final MessageDigest digest;
    private long size;

    private Sha256() {
        try {
            digest = MessageDigest.getInstance("SHA-256");
        } catch (NoSuchAlgorithmException e) {
            throw new IllegalStateException("SHA-256 is part of every Java platform", e);
        }
    }

    /** A digest of nothing yet. */
    public static Sha256 start() {
        return new Sha256();
    }

    /** The first {@code bytes} bytes of the digest of a text's UTF-8 bytes, in hex (2 digits a byte). */
    public static String hex(String text, int bytes) {
        return start().add(text).hex(bytes);
    }

    /** The first {@code bytes} bytes of the digest of some bytes, in hex (2 digits a byte). */
    public static String hex(byte[] data, int bytes) {
        return start().add(data).hex(bytes);
    }

    /** Adds a text's UTF-8 bytes. */
    public Sha256 add(String text) {
        return add(text.getBytes(StandardCharsets.UTF_8));
    }

    /** Adds some bytes. */
    public Sha256 add(byte[] data) {
        digest.update(data);
        size += data.length;
        return this;
    }

    /** Adds one byte (a separator between parts). */
    public Sha256 add(byte b) {
        digest.update(b);
        size++;
        return this;
    }

    /** Adds a file's bytes, read in blocks. */
    public Sha256 addFile(Path file) throws IOException {
        byte[] buf = new byte[1 << 16];
        try (InputStream in = Files.newInputStream(file)) {
            for (int n = in.read(buf); n >= 0; n = in.read(buf)) {
                digest.update(buf, 0, n);
                size += n;
            }
        }
        return this;
    }

    /** The number of bytes added so far. */
    public long size() {
        return size;
    }

    /** The whole digest in hex (64 digits); the digest cannot be fed further. */
    public String hex() {
        return hex(32);
    }

    /** The first {@code bytes} bytes (1 to 32) of the digest in hex; the digest cannot be fed further. */
    public String hex(int bytes) {
        if (bytes < 1 || bytes > 32) {
            throw new IllegalArgumentException("a SHA-256 prefix has 1 to 32 bytes, not " + bytes);
        }
        return HexFormat.of().formatHex(digest.digest(), 0, bytes);
    }
}

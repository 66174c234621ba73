package dev.touchstone.harness.io;

import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;

/**
 * The one SHA-256 helper against the test vectors of FIPS 180-2, Appendix B ("abc" and the
 * 448-bit message), and the empty message's digest (values from memory, widely published).
 */
class Sha256Test {

    private static final String ABC = "ba7816bf8f01cfea414140de5dae2223b00361a396177a9cb410ff61f20015ad";
    private static final String TWO_BLOCKS = "248d6a61d20638b8e5c026930c3e6039a33ce45964ff2167f6ecedd419db06c1";
    private static final String EMPTY = "e3b0c44298fc1c149afbf4c8996fb92427ae41e4649b934ca495991b7852b855";

    @Test
    void publishedVectors() {
        assertEquals(ABC, Sha256.start().add("abc").hex());
        assertEquals(TWO_BLOCKS, Sha256.start().add("abcdbcdecdefdefgefghfghighijhijkijkljklmklmnlmnomnopnopq").hex());
        assertEquals(EMPTY, Sha256.start().hex());
    }

    @Test
    void prefixesAndPartsAgree() {
        assertEquals(ABC.substring(0, 16), Sha256.hex("abc", 8));
        assertEquals(ABC.substring(0, 16), Sha256.hex("abc".getBytes(StandardCharsets.US_ASCII), 8));
        assertEquals(ABC, Sha256.start().add("a").add((byte) 'b').add("c".getBytes(StandardCharsets.UTF_8)).hex());
        assertThrows(IllegalArgumentException.class, () -> Sha256.start().hex(33));
    }

    @Test
    void filesAreDigestedWholeWithTheirSize(@TempDir Path dir) throws Exception {
        Path f = dir.resolve("m.txt");
        // larger than one read block, so the blocks are joined
        Files.write(f, "abc".repeat(40_000).getBytes(StandardCharsets.UTF_8));
        Sha256 d = Sha256.start().addFile(f);
        assertEquals(120_000, d.size());
        assertEquals(Sha256.start().add("abc".repeat(40_000)).hex(), d.hex());
        Files.write(f, "abc".getBytes(StandardCharsets.UTF_8));
        assertEquals(ABC, Sha256.start().addFile(f).hex());
    }
}

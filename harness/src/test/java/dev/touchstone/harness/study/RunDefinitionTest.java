package dev.touchstone.harness.study;

import dev.touchstone.harness.testing.TestWorld;
import org.junit.jupiter.api.Test;

import java.nio.charset.StandardCharsets;
import java.security.MessageDigest;
import java.time.Duration;
import java.util.HexFormat;
import java.util.List;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertNotEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;

/**
 * Run keys built by the builder: the first 8 bytes of the SHA-256 of the run's definition text,
 * checked against the JDK's own {@link MessageDigest} (a general-purpose library, independent of
 * the harness's helper), so keys stay those journals already hold.
 */
class RunDefinitionTest {

    private static final String STUDY = "name: keys\nseed: 11\nreplicates: 2\n"
            + "truth:\n  graph: {family: chain, nodes: [4, 5]}\n  model: {kind: linear-gaussian}\n"
            + "samples: [30, oracle]\n"
            + "learners:\n  - {id: empty, use: empty-test, with: {alpha: [0.01, 0.05]}}\n"
            + "metrics: [shd]\nlimits: {seconds: 3}\n";

    private static String sha256Prefix(String text) throws Exception {
        byte[] d = MessageDigest.getInstance("SHA-256").digest(text.getBytes(StandardCharsets.UTF_8));
        return HexFormat.of().formatHex(d, 0, 8);
    }

    @Test
    void keysAreTheDigestOfTheDefinition() throws Exception {
        Plan plan = TestWorld.plan(STUDY);
        assertEquals(2 * 2 * 2 * 2, plan.runs().size());
        for (RunDefinition r : plan.runs()) {
            String text = RunDefinition.definition(r.truth(), r.replicate(), r.sample(), r.config(), r.studySeed(),
                    r.metrics(), r.limit());
            assertEquals(sha256Prefix(text), r.key(), r.coordinates());
            assertEquals(11L, r.studySeed());
            assertEquals(Duration.ofSeconds(3), r.limit());
            assertEquals(List.of("shd"), r.metrics());
        }
    }

    @Test
    void theBuilderKeepsEveryPartAndEveryPartChangesTheKey() {
        RunDefinition r = TestWorld.plan(STUDY).runs().get(5);
        RunDefinition same = r.toBuilder().build();
        assertEquals(r, same);
        assertEquals(r.key(), same.key());
        assertEquals(r.coordinates(), same.coordinates());
        assertNotEquals(r.key(), r.toBuilder().limit(null).build().key());
        assertNotEquals(r.key(), r.toBuilder().replicate(r.replicate() + 1).build().key());
        assertNotEquals(r.key(), r.toBuilder().studySeed(12).build().key());
        assertNotEquals(r.key(), r.toBuilder().metrics(List.of("shd", "edges")).build().key());
        assertThrows(NullPointerException.class, () -> RunDefinition.builder().index(0).build());
    }
}

package dev.touchstone.core.knowledge;

import org.junit.jupiter.api.Test;

import java.util.List;
import java.util.Set;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

class KnowledgeTest {

    private static String refused(Knowledge.Builder b) {
        return assertThrows(IllegalArgumentException.class, b::build).getMessage();
    }

    @Test
    void tiersForbidBackwardEdgesOnly() {
        Knowledge k = Knowledge.builder()
                .tier(List.of("age", "sex"))
                .tier(List.of("diet"))
                .tier(List.of("weight"))
                .forbid("diet", "sex")
                .require("age", "weight")
                .build();
        assertTrue(k.isForbidden("weight", "age"));
        assertTrue(k.isForbidden("diet", "sex"));
        assertFalse(k.isForbidden("age", "diet"));
        assertFalse(k.isForbidden("age", "sex"), "same tier constrains nothing");
        assertFalse(k.isForbidden("age", "unknown"), "a variable in no tier is unconstrained");
        assertTrue(k.isRequired("age", "weight"));
        assertFalse(k.isRequired("weight", "age"));
        assertTrue(k.isAdjacencyForbidden("sex", "diet") == false);
        assertEquals(0, k.tierOf("sex"));
        assertEquals(2, k.tierOf("weight"));
        assertEquals(-1, k.tierOf("height"));
        assertEquals(Set.of("age", "sex", "diet", "weight"), k.variables());
        assertFalse(k.isEmpty());
        assertTrue(Knowledge.none().isEmpty());
    }

    @Test
    void toBuilderKeepsEveryPartAndAddsToIt() {
        Knowledge k = Knowledge.builder().tier(List.of("age", "sex")).tier(List.of("diet"))
                .forbid("diet", "sex").require("age", "diet").build();
        Knowledge copy = k.toBuilder().build();
        assertEquals(k.required(), copy.required());
        assertEquals(k.forbidden(), copy.forbidden());
        assertEquals(k.tiers(), copy.tiers());
        Knowledge more = k.toBuilder().forbid("age", "weight").build();
        assertTrue(more.isForbidden("age", "weight"));
        assertTrue(more.isRequired("age", "diet"));
        assertFalse(k.isForbidden("age", "weight"), "the original is unchanged");
    }

    @Test
    void bothDirectionsForbiddenForbidsTheAdjacency() {
        Knowledge k = Knowledge.builder().forbid("a", "b").forbid("b", "a").build();
        assertTrue(k.isAdjacencyForbidden("a", "b"));
        assertTrue(k.isAdjacencyForbidden("b", "a"));
    }

    @Test
    void requiredAndForbiddenIsRefusedNamingTheEdge() {
        String m = refused(Knowledge.builder().require("a", "b").forbid("a", "b"));
        assertEquals("edge a -> b is both required and forbidden", m);
    }

    @Test
    void requiredAgainstTiersIsRefusedNamingEdgeAndTiers() {
        String m = refused(Knowledge.builder().tier(List.of("a")).tier(List.of("b")).require("b", "a"));
        assertEquals("required edge b -> a points from tier 2 back to tier 1", m);
    }

    @Test
    void requiredCycleIsRefusedNamingTheCycle() {
        String m = refused(Knowledge.builder().require("a", "b").require("b", "c").require("c", "a"));
        assertTrue(m.startsWith("required edges form a cycle: "), m);
        for (String edge : List.of("a -> b", "b -> c", "c -> a")) {
            String rotated = m.substring("required edges form a cycle: ".length());
            // the cycle may start at any of its variables
            assertTrue((rotated + rotated.substring(rotated.indexOf(" -> "))).contains(edge), m);
        }
        String two = refused(Knowledge.builder().require("x", "y").require("y", "x"));
        assertTrue(two.contains("x -> y") && two.contains("y -> x"), two);
    }

    @Test
    void variableInTwoTiersIsRefusedNamingBoth() {
        assertEquals("variable 'b' is in tier 1 and tier 3",
                refused(Knowledge.builder().tier(List.of("a", "b")).tier(List.of("c")).tier(List.of("b"))));
        assertEquals("variable 'a' appears twice in tier 1", refused(Knowledge.builder().tier(List.of("a", "a"))));
    }

    @Test
    void selfEdgeAndUnknownVariables() {
        IllegalArgumentException self = assertThrows(IllegalArgumentException.class,
                () -> Knowledge.builder().require("a", "a"));
        assertTrue(self.getMessage().contains("'a' to itself"), self.getMessage());
        Knowledge k = Knowledge.builder().require("a", "b").build();
        k.checkVariables(List.of("a", "b", "c"));
        IllegalArgumentException unknown = assertThrows(IllegalArgumentException.class,
                () -> k.checkVariables(List.of("a", "c")));
        assertEquals("knowledge names variable 'b', which the data do not have", unknown.getMessage());
    }

    @Test
    void isImmutable() {
        Knowledge k = Knowledge.builder().require("a", "b").tier(List.of("a")).build();
        assertThrows(UnsupportedOperationException.class, () -> k.required().clear());
        assertThrows(UnsupportedOperationException.class, () -> k.tiers().get(0).add("z"));
    }
}

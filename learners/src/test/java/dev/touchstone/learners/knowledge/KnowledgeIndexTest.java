package dev.touchstone.learners.knowledge;

import dev.touchstone.core.knowledge.Knowledge;
import dev.touchstone.core.learner.LearnerException;
import org.junit.jupiter.api.Test;

import java.util.ArrayList;
import java.util.List;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

/**
 * Both layouts of the index answer every question as the knowledge does by name (the
 * definition of forbidden by tiers is the usual one of temporal tiers: a later tier may not
 * cause an earlier one; common practice).
 */
class KnowledgeIndexTest {

    private static final List<String> NAMES = List.of("a", "b", "c", "d", "e");

    private static Knowledge knowledge() {
        return Knowledge.builder().tier(List.of("a", "b")).tier(List.of("c", "d")).forbid("e", "a")
                .require("a", "c").require("e", "d").build();
    }

    @Test
    void denseAndSparseAgreeWithTheKnowledgeByName() {
        Knowledge k = knowledge();
        for (KnowledgeIndex index : List.of(KnowledgeIndex.of(k, NAMES), KnowledgeIndex.sparse(k, NAMES))) {
            assertFalse(index.isEmpty());
            for (int x = 0; x < NAMES.size(); x++) {
                for (int y = 0; y < NAMES.size(); y++) {
                    if (x == y) {
                        continue;
                    }
                    String from = NAMES.get(x);
                    String to = NAMES.get(y);
                    assertEquals(k.isForbidden(from, to), index.isForbidden(x, y), from + " -> " + to);
                    assertEquals(k.isRequired(from, to), index.isRequired(x, y), from + " -> " + to + " required");
                    assertEquals(k.isAdjacencyForbidden(from, to), index.isForbiddenBothWays(x, y));
                    assertEquals(k.isRequired(from, to) || !k.isForbidden(from, to), index.isAllowed(x, y));
                }
                assertFalse(index.isAllowed(x, x), "no self-loop");
            }
            List<String> required = new ArrayList<>();
            for (int[] e : index.requiredEdges()) {
                required.add(index.name(e[0]) + "->" + index.name(e[1]));
            }
            assertEquals(List.of("a->c", "e->d"), required);
        }
    }

    @Test
    void emptyKnowledgeForbidsAndRequiresNothing() {
        KnowledgeIndex none = KnowledgeIndex.of(Knowledge.none(), NAMES);
        assertTrue(none.isEmpty());
        assertFalse(none.isForbidden(0, 1));
        assertFalse(none.isRequiredEitherWay(0, 1));
        assertTrue(none.requiredEdges().isEmpty());
    }

    @Test
    void aVariableTheDataLackIsBadInput() {
        LearnerException e = assertThrows(LearnerException.class,
                () -> KnowledgeIndex.of(Knowledge.builder().forbid("a", "z").build(), NAMES));
        assertEquals("knowledge names variable 'z', which the data do not have", e.getMessage());
    }
}

package dev.touchstone.core.graph.algorithms;

import dev.touchstone.core.graph.Graph;
import dev.touchstone.core.graph.MutableGraph;
import org.junit.jupiter.api.DisplayName;
import org.junit.jupiter.api.Test;

import java.util.HashSet;
import java.util.List;
import java.util.Set;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

class DagEnumerationTest {

    /** OEIS A003024, number of labelled acyclic digraphs on n nodes (Robinson 1973). */
    private static final long[] A003024 = {1, 3, 25, 543, 29281, 3781503};

    @Test
    @DisplayName("labelled DAGs on n <= 5 nodes are 1, 3, 25, 543, 29281 (OEIS A003024, Robinson 1973), all distinct and acyclic")
    void countsMatchRobinson() {
        for (int n = 1; n <= 5; n++) {
            List<Graph> all = DagEnumeration.all(n);
            assertEquals(A003024[n - 1], all.size(), "n = " + n);
            Set<Graph> distinct = new HashSet<>(all);
            assertEquals(all.size(), distinct.size(), "duplicates at n = " + n);
            for (Graph g : all) {
                assertTrue(GraphChecks.isDag(g), g::toString);
            }
        }
    }

    @Test
    @DisplayName("counting without building graphs gives 3781503 DAGs on 6 nodes (OEIS A003024)")
    void countSix() {
        assertEquals(A003024[5], DagEnumeration.count(6));
        assertEquals(A003024[4], DagEnumeration.count(5));
    }

    @Test
    @DisplayName("on 4 nodes the enumeration keeps exactly the orientations that Ancestry finds acyclic")
    void agreesWithAncestryOnEveryOrientation() {
        int n = 4;
        List<String> names = DagEnumeration.defaultNames(n);
        Set<Graph> enumerated = new HashSet<>(DagEnumeration.all(names));
        int pairs = n * (n - 1) / 2;
        int total = 1;
        for (int i = 0; i < pairs; i++) {
            total *= 3;
        }
        int acyclic = 0;
        for (int code = 0; code < total; code++) {
            MutableGraph g = Graph.builder(names);
            int c = code;
            for (int i = 0; i < n; i++) {
                for (int j = i + 1; j < n; j++) {
                    int digit = c % 3;
                    c /= 3;
                    if (digit == 1) {
                        g.addDirected(i, j);
                    } else if (digit == 2) {
                        g.addDirected(j, i);
                    }
                }
            }
            Graph frozen = g.freeze();
            boolean isAcyclic = Ancestry.isAcyclic(frozen);
            assertEquals(isAcyclic, enumerated.contains(frozen), frozen::toString);
            if (isAcyclic) {
                acyclic++;
            }
        }
        assertEquals(543, acyclic);
    }

    @Test
    void refusesSizesItCannotEnumerate() {
        IllegalArgumentException e = assertThrows(IllegalArgumentException.class, () -> DagEnumeration.all(6));
        assertTrue(e.getMessage().contains("not 6"), e.getMessage());
        assertThrows(IllegalArgumentException.class, () -> DagEnumeration.count(7));
        assertThrows(IllegalArgumentException.class, () -> DagEnumeration.count(0));
    }
}

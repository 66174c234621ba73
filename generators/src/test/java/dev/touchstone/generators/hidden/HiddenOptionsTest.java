package dev.touchstone.generators.hidden;

import dev.touchstone.core.graph.Graph;
import dev.touchstone.core.param.ParameterException;
import dev.touchstone.core.random.Seeds;
import dev.touchstone.generators.graphs.GraphFamilies;
import dev.touchstone.generators.graphs.GraphFamily;
import org.junit.jupiter.api.DisplayName;
import org.junit.jupiter.api.Test;

import java.util.Map;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertSame;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

class HiddenOptionsTest {

    private static Graph dag(long seed) {
        GraphFamily f = GraphFamilies.byId("erdos-renyi");
        return f.generate(f.resolve(Map.of("nodes", 30, "mean_degree", 3)), Seeds.random(seed)).dag();
    }

    @Test
    @DisplayName("random hides exactly k variables and keeps every edge")
    void random() {
        Graph g = dag(1);
        HiddenOption o = HiddenOptions.byId("random");
        Graph h = o.apply(g, o.resolve(Map.of("count", 4)), Seeds.random(2));
        assertEquals(4, h.hiddenNames().size());
        assertTrue(h.sameEdges(g));
    }

    @Test
    @DisplayName("confounders hides only variables with at least two children")
    void confounders() {
        for (int s = 0; s < 20; s++) {
            Graph g = dag(10 + s);
            HiddenOption o = HiddenOptions.byId("confounders");
            Graph h = o.apply(g, o.resolve(Map.of("count", 3)), Seeds.random(s));
            assertTrue(h.hiddenNames().size() <= 3 && !h.hiddenNames().isEmpty());
            for (String name : h.hiddenNames()) {
                assertTrue(g.children(g.index(name)).length >= 2, name);
            }
        }
    }

    @Test
    @DisplayName("none keeps the graph; hiding all variables is refused naming 'count'")
    void noneAndTooMany() {
        Graph g = dag(3);
        HiddenOption none = HiddenOptions.byId("none");
        assertSame(g, none.apply(g, none.resolve(Map.of()), Seeds.random(1)));
        HiddenOption r = HiddenOptions.byId("random");
        ParameterException e = assertThrows(ParameterException.class,
                () -> r.apply(g, r.resolve(Map.of("count", 30)), Seeds.random(1)));
        assertEquals("count", e.parameter());
    }
}

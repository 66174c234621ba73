package dev.touchstone.core.graph.algorithms;

import dev.touchstone.core.graph.Edge;
import dev.touchstone.core.graph.Graph;
import dev.touchstone.core.graph.Mark;
import dev.touchstone.core.graph.MutableGraph;
import dev.touchstone.core.testing.RandomDags;
import org.junit.jupiter.api.DisplayName;
import org.junit.jupiter.api.Test;

import java.util.List;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

/**
 * The rules against the definition of the PAG (Zhang 2008, §2; Markov equivalence of MAGs
 * as in Richardson and Spirtes 2002): on small random DAGs with hidden confounders, the PAG
 * built by the rules equals the graph read off the enumerated Markov equivalence class.
 * This checks soundness (no wrong tail or arrow) and completeness (no needless circle) of
 * the rules together; the oracle uses no orientation rule.
 */
class PagDefinitionTest {

    @Test
    @DisplayName("no selection: PAG = invariant marks of the class of MAGs without undirected edges (Zhang 2008, §2 and §4)")
    void pagEqualsDefinitionOnSmallRandomGraphs() {
        int checked = 0;
        int informative = 0;
        for (long seed = 1; checked < 60 && seed < 2000; seed++) {
            Graph dag = smallDag(seed);
            Graph mag = LatentProjection.mag(dag);
            if (mag.size() > 6 || mag.edgeCount() > 8 || mag.edgeCount() < 3) {
                continue;
            }
            List<Graph> members = MarkovClasses.equivalenceClass(mag, false);
            assertTrue(members.contains(mag), "the MAG is in its own class");
            Graph expected = MarkovClasses.pagByDefinition(members);
            assertEquals(expected, Pags.of(dag), "seed " + seed + ", DAG " + dag + " hidden " + dag.hiddenNames()
                    + ", MAG " + mag);
            checked++;
            if (hasNonCircleMark(expected)) {
                informative++;
            }
        }
        assertTrue(checked >= 60, "checked " + checked);
        assertTrue(informative >= 30, "the sample must exercise orientations, got " + informative);
    }

    @Test
    @DisplayName("selection allowed: complete rules R1–R10 = invariant marks of the class including undirected MAGs (Zhang 2008, main theorem; from memory)")
    void completeRulesEqualDefinitionWithUndirectedMembers() {
        int checked = 0;
        int withUndirectedMembers = 0;
        for (long seed = 1; checked < 40 && seed < 2000; seed++) {
            Graph mag = LatentProjection.mag(smallDag(seed));
            if (mag.size() > 6 || mag.edgeCount() > 6 || mag.edgeCount() < 3) {
                continue;
            }
            List<Graph> members = MarkovClasses.equivalenceClass(mag, true);
            Graph expected = MarkovClasses.pagByDefinition(members);
            // Every member, with or without undirected edges, must give the class's PAG.
            for (Graph member : members) {
                assertEquals(expected, pagWith(PagRules.complete(), member), "seed " + seed + ", member " + member);
                if (member.edges().stream().anyMatch(Edge::isUndirected)) {
                    withUndirectedMembers++;
                    assertEquals(expected, Pags.ofMag(member), "seed " + seed + ", member " + member);
                }
            }
            checked++;
        }
        assertTrue(checked >= 40, "checked " + checked);
        assertTrue(withUndirectedMembers >= 40, "undirected members seen: " + withUndirectedMembers);
    }

    static Graph smallDag(long seed) {
        int n = 6 + (int) (seed % 3);
        return RandomDags.hideConfounders(RandomDags.erdosRenyi(n, 2.6, seed), (int) (seed % 3), seed * 7);
    }

    static Graph pagWith(PagRules rules, Graph mag) {
        MutableGraph pag = Graph.builder(mag.names());
        for (Edge e : mag.edges()) {
            pag.addEdge(e.a(), e.b(), Mark.CIRCLE, Mark.CIRCLE);
        }
        rules.orient(pag, SeparationInfo.fromMag(mag));
        return pag.freeze();
    }

    static boolean hasNonCircleMark(Graph g) {
        return g.edges().stream().anyMatch(e -> e.atA() != Mark.CIRCLE || e.atB() != Mark.CIRCLE);
    }
}

package dev.touchstone.generators.networks;

import dev.touchstone.core.data.DataSet;
import dev.touchstone.core.graph.Graph;
import dev.touchstone.core.graph.algorithms.Ancestry;
import org.junit.jupiter.api.DisplayName;
import org.junit.jupiter.api.Test;

import java.util.LinkedHashMap;
import java.util.Map;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

class ReferenceNetworksTest {

    @Test
    @DisplayName("chest clinic: marginals of 200,000 rows within 4 SE of the published ones (Lauritzen and Spiegelhalter 1988, from memory)")
    void chestClinicMarginals() {
        ReferenceNetwork net = ReferenceNetworks.byId("chest-clinic");
        Map<String, Double> published = new LinkedHashMap<>();
        published.put("asia", 0.01);
        published.put("smoke", 0.5);
        published.put("tub", 0.0104);
        published.put("lung", 0.055);
        published.put("bronc", 0.45);
        published.put("either", 0.064828);
        published.put("xray", 0.11029);
        published.put("dysp", 0.43597);
        int n = 200_000;
        DataSet d = net.model().sample(n, 2024);
        for (Map.Entry<String, Double> e : published.entrySet()) {
            int j = d.indexOf(e.getKey());
            assertEquals("yes", d.variable(j).categories().get(1));
            int yes = 0;
            for (int c : d.discrete(j)) {
                yes += c;
            }
            double p = e.getValue();
            assertEquals(p, yes / (double) n, 4 * Math.sqrt(p * (1 - p) / n), e.getKey());
        }
        // either is the logical OR of tub and lung, row by row.
        int[] tub = d.discrete(d.indexOf("tub"));
        int[] lung = d.discrete(d.indexOf("lung"));
        int[] either = d.discrete(d.indexOf("either"));
        for (int r = 0; r < n; r++) {
            assertEquals(tub[r] | lung[r], either[r]);
        }
    }

    private static boolean arc(Graph g, String from, String to) {
        return g.hasDirected(g.index(from), g.index(to));
    }

    @Test
    @DisplayName("chest clinic has the 8 published arcs; sprinkler has Pearl's 5 arcs (Pearl 2000, ch. 1)")
    void structures() {
        Graph asia = ReferenceNetworks.chestClinic().dag();
        assertEquals(8, asia.edgeCount());
        for (String[] a : new String[][] {{"asia", "tub"}, {"smoke", "lung"}, {"smoke", "bronc"}, {"tub", "either"},
                {"lung", "either"}, {"either", "xray"}, {"either", "dysp"}, {"bronc", "dysp"}}) {
            assertTrue(arc(asia, a[0], a[1]), a[0] + " -> " + a[1]);
        }
        Graph sprinkler = ReferenceNetworks.sprinkler().dag();
        assertEquals(5, sprinkler.edgeCount());
        for (String[] a : new String[][] {{"season", "sprinkler"}, {"season", "rain"}, {"sprinkler", "wet"},
                {"rain", "wet"}, {"wet", "slippery"}}) {
            assertTrue(arc(sprinkler, a[0], a[1]), a[0] + " -> " + a[1]);
        }
    }

    @Test
    @DisplayName("community garden: 10 variables, acyclic, tables valid, and the harvest responds to soil moisture")
    void communityGarden() {
        ReferenceNetwork net = ReferenceNetworks.communityGarden();
        assertEquals(10, net.dag().size());
        assertTrue(Ancestry.isAcyclic(net.dag()));
        DataSet d = net.model().sample(50_000, 5);
        int[] soil = d.discrete(d.indexOf("soil_moisture"));
        int[] harvest = d.discrete(d.indexOf("harvest"));
        double goodWhenDry = share(harvest, soil, 0, 2);
        double goodWhenMoist = share(harvest, soil, 1, 2);
        assertTrue(goodWhenMoist > goodWhenDry + 0.1, goodWhenDry + " vs " + goodWhenMoist);
    }

    private static double share(int[] target, int[] given, int givenCode, int targetCode) {
        int n = 0;
        int hit = 0;
        for (int r = 0; r < target.length; r++) {
            if (given[r] == givenCode) {
                n++;
                hit += target[r] == targetCode ? 1 : 0;
            }
        }
        return hit / (double) n;
    }

    @Test
    @DisplayName("an unknown network is refused with the known ids listed")
    void unknown() {
        String m = assertThrows(IllegalArgumentException.class, () -> ReferenceNetworks.byId("alarm")).getMessage();
        assertTrue(m.contains("chest-clinic") && m.contains("community-garden"), m);
    }
}

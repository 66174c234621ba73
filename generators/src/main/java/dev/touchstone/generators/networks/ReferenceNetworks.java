package dev.touchstone.generators.networks;

import dev.touchstone.core.graph.Graph;
import dev.touchstone.core.graph.MutableGraph;
import dev.touchstone.generators.Registry;
import dev.touchstone.generators.models.DiscreteNetworkModel;

import java.util.List;

/**
 * The built-in reference networks, with their conditional tables.
 *
 * <ul>
 * <li>{@code chest-clinic}: the "Asia" network of Lauritzen and Spiegelhalter (1988,
 *     "Local computations with probabilities on graphical structures and their application
 *     to expert systems", JRSS B 50), 8 binary variables, with the published
 *     probabilities (from memory). Categories are
 *     {@code no, yes}.</li>
 * <li>{@code sprinkler}: the structure of Pearl's sprinkler example (Pearl 2000,
 *     Causality, ch. 1). The conditional tables are our own and illustrative only: the
 *     book gives the structure, not these numbers.</li>
 * <li>{@code community-garden}: an invented network of 10 variables set in a
 *     volunteer-run community garden (weather, the watering rota and mulching drive soil
 *     moisture, which drives slugs, weeds and finally the harvest sold at the weekly
 *     stall). Its structure and tables are our own, chosen to be plausible, for the demo
 *     and examples; it describes no real garden.</li>
 * </ul>
 */
public final class ReferenceNetworks {

    public static final String CHEST_CLINIC = "chest-clinic";
    public static final String SPRINKLER = "sprinkler";
    public static final String COMMUNITY_GARDEN = "community-garden";

    private static final List<String> NO_YES = List.of("no", "yes");

    private ReferenceNetworks() {
    }

    /** Every built-in network, in listing order. */
    public static List<ReferenceNetwork> all() {
        return List.of(chestClinic(), sprinkler(), communityGarden());
    }

    /**
     * The network with this id.
     *
     * @throws IllegalArgumentException naming the id and listing the known ones
     */
    public static ReferenceNetwork byId(String id) {
        return Registry.byId(all(), ReferenceNetwork::id, "network", id);
    }

    private static Graph dag(List<String> names, String... arcs) {
        MutableGraph g = Graph.builder(names);
        for (String arc : arcs) {
            String[] ends = arc.split("->");
            g.addDirected(g.indexOf(ends[0].trim()), g.indexOf(ends[1].trim()));
        }
        return g.freeze();
    }

    private static double[] p(double... probs) {
        return probs;
    }

    /** The chest-clinic ("Asia") network of Lauritzen and Spiegelhalter (1988). */
    public static ReferenceNetwork chestClinic() {
        List<String> names = List.of("asia", "tub", "smoke", "lung", "bronc", "either", "xray", "dysp");
        Graph g = dag(names, "asia->tub", "smoke->lung", "smoke->bronc", "tub->either", "lung->either",
                "either->xray", "either->dysp", "bronc->dysp");
        DiscreteNetworkModel.Builder b = DiscreteNetworkModel.builder(g);
        for (String n : names) {
            b.variable(n, NO_YES);
        }
        b.table("asia", List.of(), p(0.99, 0.01));
        b.table("tub", List.of("asia"), p(0.99, 0.01), p(0.95, 0.05));
        b.table("smoke", List.of(), p(0.5, 0.5));
        b.table("lung", List.of("smoke"), p(0.99, 0.01), p(0.9, 0.1));
        b.table("bronc", List.of("smoke"), p(0.7, 0.3), p(0.4, 0.6));
        // either = tub OR lung: rows (tub, lung) = (no,no), (no,yes), (yes,no), (yes,yes).
        b.table("either", List.of("tub", "lung"), p(1, 0), p(0, 1), p(0, 1), p(0, 1));
        b.table("xray", List.of("either"), p(0.95, 0.05), p(0.02, 0.98));
        // rows (either, bronc) = (no,no), (no,yes), (yes,no), (yes,yes).
        b.table("dysp", List.of("either", "bronc"), p(0.9, 0.1), p(0.2, 0.8), p(0.3, 0.7), p(0.1, 0.9));
        return new ReferenceNetwork(CHEST_CLINIC, "chest clinic (Asia)",
                "Lauritzen and Spiegelhalter (1988), JRSS B 50; probabilities as published (from memory)",
                "'either' is the logical OR of 'tub' and 'lung', a deterministic node that breaks faithfulness",
                b.build(CHEST_CLINIC));
    }

    /** Pearl's sprinkler structure with illustrative tables of our own. */
    public static ReferenceNetwork sprinkler() {
        List<String> names = List.of("season", "sprinkler", "rain", "wet", "slippery");
        Graph g = dag(names, "season->sprinkler", "season->rain", "sprinkler->wet", "rain->wet", "wet->slippery");
        DiscreteNetworkModel.Builder b = DiscreteNetworkModel.builder(g);
        b.variable("season", List.of("winter", "spring", "summer", "autumn"));
        b.variable("sprinkler", List.of("off", "on"));
        b.variable("rain", NO_YES);
        b.variable("wet", NO_YES);
        b.variable("slippery", NO_YES);
        b.table("season", List.of(), p(0.25, 0.25, 0.25, 0.25));
        b.table("sprinkler", List.of("season"), p(0.9, 0.1), p(0.6, 0.4), p(0.3, 0.7), p(0.7, 0.3));
        b.table("rain", List.of("season"), p(0.3, 0.7), p(0.6, 0.4), p(0.85, 0.15), p(0.4, 0.6));
        // rows (sprinkler, rain) = (off,no), (off,yes), (on,no), (on,yes).
        b.table("wet", List.of("sprinkler", "rain"), p(0.95, 0.05), p(0.1, 0.9), p(0.1, 0.9), p(0.01, 0.99));
        b.table("slippery", List.of("wet"), p(0.95, 0.05), p(0.3, 0.7));
        return new ReferenceNetwork(SPRINKLER, "sprinkler",
                "structure from Pearl (2000), Causality, ch. 1; conditional tables are our own and illustrative",
                "the tables are illustrative, not published values", b.build(SPRINKLER));
    }

    /** The invented community-garden network (10 variables, 13 arcs). */
    public static ReferenceNetwork communityGarden() {
        List<String> names = List.of("frost", "rain", "rota_kept", "mulch", "soil_moisture", "slugs",
                "seedling_loss", "weeds", "harvest", "market_stall");
        Graph g = dag(names, "rain->soil_moisture", "rota_kept->soil_moisture", "mulch->soil_moisture",
                "soil_moisture->slugs", "frost->slugs", "frost->seedling_loss", "slugs->seedling_loss",
                "mulch->weeds", "soil_moisture->weeds", "seedling_loss->harvest", "weeds->harvest",
                "soil_moisture->harvest", "harvest->market_stall");
        DiscreteNetworkModel.Builder b = DiscreteNetworkModel.builder(g);
        b.variable("frost", NO_YES);
        b.variable("rain", List.of("low", "normal", "high"));
        b.variable("rota_kept", NO_YES);
        b.variable("mulch", NO_YES);
        b.variable("soil_moisture", List.of("dry", "moist", "wet"));
        b.variable("slugs", List.of("low", "high"));
        b.variable("seedling_loss", List.of("low", "high"));
        b.variable("weeds", List.of("low", "high"));
        b.variable("harvest", List.of("poor", "fair", "good"));
        b.variable("market_stall", List.of("no", "yes"));
        b.table("frost", List.of(), p(0.8, 0.2));
        b.table("rain", List.of(), p(0.3, 0.5, 0.2));
        b.table("rota_kept", List.of(), p(0.25, 0.75));
        b.table("mulch", List.of(), p(0.6, 0.4));
        // rows (rain, rota_kept, mulch), mulch fastest: watering and mulch keep soil moist in dry spells.
        b.table("soil_moisture", List.of("rain", "rota_kept", "mulch"),
                p(0.85, 0.14, 0.01), p(0.65, 0.33, 0.02),   // low rain, rota missed
                p(0.40, 0.55, 0.05), p(0.20, 0.70, 0.10),   // low rain, rota kept
                p(0.35, 0.55, 0.10), p(0.20, 0.65, 0.15),   // normal rain, rota missed
                p(0.10, 0.70, 0.20), p(0.05, 0.70, 0.25),   // normal rain, rota kept
                p(0.05, 0.45, 0.50), p(0.02, 0.40, 0.58),   // high rain, rota missed
                p(0.02, 0.38, 0.60), p(0.01, 0.34, 0.65));  // high rain, rota kept
        // rows (soil_moisture, frost), frost fastest: slugs like wet soil; frost knocks them back.
        b.table("slugs", List.of("soil_moisture", "frost"),
                p(0.85, 0.15), p(0.95, 0.05),
                p(0.55, 0.45), p(0.80, 0.20),
                p(0.25, 0.75), p(0.60, 0.40));
        // rows (frost, slugs), slugs fastest.
        b.table("seedling_loss", List.of("frost", "slugs"),
                p(0.90, 0.10), p(0.45, 0.55),
                p(0.50, 0.50), p(0.20, 0.80));
        // rows (mulch, soil_moisture), moisture fastest: mulch suppresses weeds, moisture helps them.
        b.table("weeds", List.of("mulch", "soil_moisture"),
                p(0.70, 0.30), p(0.45, 0.55), p(0.30, 0.70),
                p(0.90, 0.10), p(0.80, 0.20), p(0.65, 0.35));
        // rows (seedling_loss, weeds, soil_moisture), moisture fastest.
        b.table("harvest", List.of("seedling_loss", "weeds", "soil_moisture"),
                p(0.50, 0.40, 0.10), p(0.10, 0.40, 0.50), p(0.20, 0.45, 0.35),   // low loss, low weeds
                p(0.65, 0.30, 0.05), p(0.25, 0.50, 0.25), p(0.35, 0.45, 0.20),   // low loss, high weeds
                p(0.80, 0.18, 0.02), p(0.45, 0.45, 0.10), p(0.55, 0.38, 0.07),   // high loss, low weeds
                p(0.90, 0.09, 0.01), p(0.60, 0.35, 0.05), p(0.70, 0.27, 0.03));  // high loss, high weeds
        b.table("market_stall", List.of("harvest"), p(0.95, 0.05), p(0.60, 0.40), p(0.15, 0.85));
        return new ReferenceNetwork(COMMUNITY_GARDEN, "community garden (invented)",
                "invented for Touchstone's demo and examples; structure and tables are our own",
                "an invented scenario: plausible, but it describes no real garden", b.build(COMMUNITY_GARDEN));
    }
}

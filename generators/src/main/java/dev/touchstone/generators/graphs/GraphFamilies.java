package dev.touchstone.generators.graphs;

import dev.touchstone.generators.Registry;

import java.util.List;

/** The registry of built-in graph families, in listing order. */
public final class GraphFamilies {

    private static final List<GraphFamily> ALL = List.of(new ErdosRenyiFamily(), new PreferentialAttachmentFamily(),
            new FixedInDegreeFamily(), new LayeredFamily(), GivenGraphFamily.unbound());

    private GraphFamilies() {
    }

    /** Every built-in family (the {@code given} entry unbound). */
    public static List<GraphFamily> all() {
        return ALL;
    }

    /**
     * The family with this id.
     *
     * @throws IllegalArgumentException naming the id and listing the known ones
     */
    public static GraphFamily byId(String id) {
        return Registry.byId(ALL, GraphFamily::id, "graph family", id);
    }
}

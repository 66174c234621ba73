package dev.touchstone.generators.graphs;

import java.util.ArrayList;
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
        for (GraphFamily f : ALL) {
            if (f.id().equals(id)) {
                return f;
            }
        }
        List<String> known = new ArrayList<>();
        for (GraphFamily f : ALL) {
            known.add(f.id());
        }
        throw new IllegalArgumentException("unknown graph family '" + id + "' (known: " + String.join(", ", known) + ")");
    }
}

package dev.touchstone.learners.functional;

import dev.touchstone.core.knowledge.Knowledge;

import java.util.List;

/**
 * Background knowledge as CAM's stages use it, by column index: whether an edge j → k may be
 * searched (not forbidden, explicitly or by tiers, and not a self-loop; required edges are
 * always allowed) and whether it is required (placed before the search, never pruned).
 * Memory O(p²) booleans.
 */
final class CamEdgeRules {

    private final List<String> names;
    private final boolean[][] allowed;
    private final boolean[][] required;

    private CamEdgeRules(List<String> names, boolean[][] allowed, boolean[][] required) {
        this.names = names;
        this.allowed = allowed;
        this.required = required;
    }

    /**
     * The rules of {@code knowledge} over these variables.
     *
     * @throws IllegalArgumentException naming a variable the knowledge mentions that is not among {@code names}
     */
    static CamEdgeRules of(Knowledge knowledge, List<String> names) {
        knowledge.checkVariables(names);
        int p = names.size();
        boolean[][] allowed = new boolean[p][p];
        boolean[][] required = new boolean[p][p];
        for (int j = 0; j < p; j++) {
            for (int k = 0; k < p; k++) {
                required[j][k] = j != k && knowledge.isRequired(names.get(j), names.get(k));
                allowed[j][k] = j != k && (required[j][k] || !knowledge.isForbidden(names.get(j), names.get(k)));
            }
        }
        return new CamEdgeRules(List.copyOf(names), allowed, required);
    }

    boolean allowed(int from, int to) {
        return allowed[from][to];
    }

    boolean required(int from, int to) {
        return required[from][to];
    }

    String name(int v) {
        return names.get(v);
    }
}

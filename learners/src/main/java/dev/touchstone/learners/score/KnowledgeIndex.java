package dev.touchstone.learners.score;

import dev.touchstone.core.knowledge.Knowledge;

import java.util.ArrayList;
import java.util.List;

/**
 * Background knowledge translated to variable indices once, so the searches test a
 * directed pair in O(1): forbidden[a·p + b] says a → b may not appear (explicitly or by
 * tiers), and the required edges are listed. Memory O(p²) booleans.
 */
final class KnowledgeIndex {

    private final int p;
    private final boolean[] forbidden;
    private final boolean[] required;
    private final List<int[]> requiredEdges;
    private final boolean empty;

    private KnowledgeIndex(int p, boolean[] forbidden, boolean[] required, List<int[]> requiredEdges) {
        this.p = p;
        this.forbidden = forbidden;
        this.required = required;
        this.requiredEdges = requiredEdges;
        this.empty = requiredEdges.isEmpty() && !anyForbidden();
    }

    /**
     * The index of {@code knowledge} over these variables.
     *
     * @throws IllegalArgumentException naming a variable the knowledge mentions that is not among {@code names}
     */
    static KnowledgeIndex of(Knowledge knowledge, List<String> names) {
        knowledge.checkVariables(names);
        int p = names.size();
        // no p × p tables without knowledge: at p = 10,000 they would be 200 MB of false
        boolean[] forbidden = knowledge.isEmpty() ? null : new boolean[p * p];
        boolean[] required = knowledge.isEmpty() ? null : new boolean[p * p];
        List<int[]> req = new ArrayList<>();
        if (!knowledge.isEmpty()) {
            for (int a = 0; a < p; a++) {
                for (int b = 0; b < p; b++) {
                    if (a != b && knowledge.isForbidden(names.get(a), names.get(b))) {
                        forbidden[a * p + b] = true;
                    }
                }
            }
            for (Knowledge.DirectedPair e : knowledge.required()) {
                int a = names.indexOf(e.from());
                int b = names.indexOf(e.to());
                required[a * p + b] = true;
                req.add(new int[] {a, b});
            }
        }
        return new KnowledgeIndex(p, forbidden, required, List.copyOf(req));
    }

    boolean isForbidden(int from, int to) {
        return forbidden != null && forbidden[from * p + to];
    }

    boolean isRequired(int from, int to) {
        return required != null && required[from * p + to];
    }

    /** Whether the edge between a and b is required in either direction. */
    boolean isRequiredEitherWay(int a, int b) {
        return required != null && (required[a * p + b] || required[b * p + a]);
    }

    /** The required edges as {from, to} pairs. */
    List<int[]> requiredEdges() {
        return requiredEdges;
    }

    boolean isEmpty() {
        return empty;
    }

    private boolean anyForbidden() {
        if (forbidden == null) {
            return false;
        }
        for (boolean f : forbidden) {
            if (f) {
                return true;
            }
        }
        return false;
    }
}

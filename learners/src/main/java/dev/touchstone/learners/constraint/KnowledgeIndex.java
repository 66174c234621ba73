package dev.touchstone.learners.constraint;

import dev.touchstone.core.knowledge.Knowledge;

import java.util.HashSet;
import java.util.List;
import java.util.Set;

/**
 * Background knowledge translated to variable positions, so that the search loops ask
 * "is a → b forbidden?" in O(1) without building names. Immutable, thread-safe.
 */
final class KnowledgeIndex {

    private final int p;
    private final boolean empty;
    private final int[] tier;
    private final Set<Long> forbidden = new HashSet<>();
    private final Set<Long> required = new HashSet<>();
    private final int[][] requiredPairs;

    KnowledgeIndex(Knowledge knowledge, List<String> names) {
        this.p = names.size();
        this.empty = knowledge.isEmpty();
        knowledge.checkVariables(names);
        this.tier = new int[p];
        for (int v = 0; v < p; v++) {
            tier[v] = empty ? -1 : knowledge.tierOf(names.get(v));
        }
        java.util.Map<String, Integer> index = new java.util.HashMap<>();
        for (int v = 0; v < p; v++) {
            index.put(names.get(v), v);
        }
        for (Knowledge.DirectedPair d : knowledge.forbidden()) {
            forbidden.add(key(index.get(d.from()), index.get(d.to())));
        }
        requiredPairs = new int[knowledge.required().size()][];
        int k = 0;
        for (Knowledge.DirectedPair d : knowledge.required()) {
            int a = index.get(d.from());
            int b = index.get(d.to());
            required.add(key(a, b));
            requiredPairs[k++] = new int[] {a, b};
        }
    }

    private long key(int from, int to) {
        return (long) from * p + to;
    }

    boolean isEmpty() {
        return empty;
    }

    /** Whether {@code from → to} is forbidden, explicitly or by tiers. */
    boolean forbidden(int from, int to) {
        if (empty) {
            return false;
        }
        int tf = tier[from];
        int tt = tier[to];
        if (tf >= 0 && tt >= 0 && tf > tt) {
            return true;
        }
        return !forbidden.isEmpty() && forbidden.contains(key(from, to));
    }

    /** Whether {@code from → to} is required. */
    boolean required(int from, int to) {
        return !empty && !required.isEmpty() && required.contains(key(from, to));
    }

    /** Whether a required edge joins a and b in either direction (their adjacency must stay). */
    boolean adjacencyRequired(int a, int b) {
        return required(a, b) || required(b, a);
    }

    /** Whether both directions are forbidden (the pair can never be adjacent). */
    boolean adjacencyForbidden(int a, int b) {
        return forbidden(a, b) && forbidden(b, a);
    }

    /** The required edges as (from, to) positions. */
    int[][] requiredPairs() {
        return requiredPairs;
    }
}

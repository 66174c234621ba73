package dev.touchstone.learners.knowledge;

import dev.touchstone.core.knowledge.Knowledge;
import dev.touchstone.core.learner.LearnerException;

import java.util.ArrayList;
import java.util.HashMap;
import java.util.HashSet;
import java.util.List;
import java.util.Map;
import java.util.Set;

/**
 * Background knowledge translated to variable positions once, so that search loops ask "is
 * a → b forbidden?" in O(1) without building names: the one index every learner family uses
 * (constraint, score, hybrid and functional searches). A directed pair is forbidden when the
 * knowledge forbids it explicitly or its tiers do ({@link Knowledge#isForbidden}); required
 * pairs are listed. Immutable, thread-safe.
 *
 * <p>Two internal layouts answer the same questions. Up to {@value #DENSE_LIMIT} variables
 * the answers sit in p × p boolean tables (at most 8 MiB), so the score searches' innermost
 * loops pay one array read per question; above it, where only the constraint searches run,
 * a tier array and hash sets of the explicit pairs keep memory O(p + pairs). Empty
 * knowledge builds neither and answers every question at once.
 */
public final class KnowledgeIndex {

    /** The most variables for which the p × p tables are built. */
    static final int DENSE_LIMIT = 2048;

    private final List<String> names;
    private final int p;
    private final boolean empty;
    private final List<int[]> requiredEdges;
    // Dense layout (null when sparse or empty).
    private final boolean[] forbiddenTable;
    private final boolean[] requiredTable;
    // Sparse layout (null when dense or empty).
    private final int[] tier;
    private final Set<Long> forbiddenPairs;
    private final Set<Long> requiredPairs;

    private KnowledgeIndex(Knowledge knowledge, List<String> names, boolean dense) {
        this.names = List.copyOf(names);
        this.p = names.size();
        this.empty = knowledge.isEmpty();
        Map<String, Integer> position = new HashMap<>();
        for (int v = 0; v < p; v++) {
            position.put(names.get(v), v);
        }
        List<int[]> req = new ArrayList<>();
        for (Knowledge.DirectedPair d : knowledge.required()) {
            req.add(new int[] {position.get(d.from()), position.get(d.to())});
        }
        this.requiredEdges = List.copyOf(req);
        if (empty) {
            forbiddenTable = requiredTable = null;
            tier = null;
            forbiddenPairs = requiredPairs = null;
        } else if (dense) {
            forbiddenTable = new boolean[p * p];
            requiredTable = new boolean[p * p];
            for (int a = 0; a < p; a++) {
                for (int b = 0; b < p; b++) {
                    forbiddenTable[a * p + b] = a != b && knowledge.isForbidden(names.get(a), names.get(b));
                }
            }
            for (int[] e : requiredEdges) {
                requiredTable[e[0] * p + e[1]] = true;
            }
            tier = null;
            forbiddenPairs = requiredPairs = null;
        } else {
            forbiddenTable = requiredTable = null;
            tier = new int[p];
            for (int v = 0; v < p; v++) {
                tier[v] = knowledge.tierOf(names.get(v));
            }
            forbiddenPairs = new HashSet<>();
            for (Knowledge.DirectedPair d : knowledge.forbidden()) {
                forbiddenPairs.add(key(position.get(d.from()), position.get(d.to())));
            }
            requiredPairs = new HashSet<>();
            for (int[] e : requiredEdges) {
                requiredPairs.add(key(e[0], e[1]));
            }
        }
    }

    /**
     * The index of {@code knowledge} over these variables, in this order.
     *
     * @throws LearnerException naming a variable the knowledge mentions that is not among {@code names}
     */
    public static KnowledgeIndex of(Knowledge knowledge, List<String> names) {
        checkVariables(knowledge, names);
        return new KnowledgeIndex(knowledge, names, names.size() <= DENSE_LIMIT);
    }

    /** The same index in the layout for many variables whatever their number (to check that both agree). */
    static KnowledgeIndex sparse(Knowledge knowledge, List<String> names) {
        checkVariables(knowledge, names);
        return new KnowledgeIndex(knowledge, names, false);
    }

    private static void checkVariables(Knowledge knowledge, List<String> names) {
        try {
            knowledge.checkVariables(names);
        } catch (IllegalArgumentException e) {
            throw new LearnerException(e.getMessage(), e);
        }
    }

    private long key(int from, int to) {
        return (long) from * p + to;
    }

    /** Whether the knowledge says nothing at all. */
    public boolean isEmpty() {
        return empty;
    }

    /** Whether {@code from → to} is forbidden, explicitly or by tiers. */
    public boolean isForbidden(int from, int to) {
        // The dense table first: it is the score searches' innermost question.
        if (forbiddenTable != null) {
            return forbiddenTable[from * p + to];
        }
        if (empty) {
            return false;
        }
        int tf = tier[from];
        int tt = tier[to];
        if (tf >= 0 && tt >= 0 && tf > tt) {
            return true;
        }
        return !forbiddenPairs.isEmpty() && forbiddenPairs.contains(key(from, to));
    }

    /** Whether {@code from → to} is required. */
    public boolean isRequired(int from, int to) {
        if (requiredTable != null) {
            return requiredTable[from * p + to];
        }
        return !empty && !requiredEdges.isEmpty() && requiredPairs.contains(key(from, to));
    }

    /** Whether a required edge joins a and b in either direction (their adjacency must stay). */
    public boolean isRequiredEitherWay(int a, int b) {
        return isRequired(a, b) || isRequired(b, a);
    }

    /** Whether both directions are forbidden (the pair can never be adjacent). */
    public boolean isForbiddenBothWays(int a, int b) {
        return isForbidden(a, b) && isForbidden(b, a);
    }

    /** Whether a search may consider {@code from → to}: not a self-loop, and required or not forbidden. */
    public boolean isAllowed(int from, int to) {
        return from != to && (isRequired(from, to) || !isForbidden(from, to));
    }

    /** The required edges as {from, to} positions, in the order the knowledge lists them. */
    public List<int[]> requiredEdges() {
        return requiredEdges;
    }

    /** The name of the variable at position {@code v}, for messages. */
    public String name(int v) {
        return names.get(v);
    }
}

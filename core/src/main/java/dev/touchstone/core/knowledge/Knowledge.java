package dev.touchstone.core.knowledge;

import java.util.ArrayDeque;
import java.util.ArrayList;
import java.util.Collections;
import java.util.Deque;
import java.util.HashMap;
import java.util.HashSet;
import java.util.LinkedHashSet;
import java.util.List;
import java.util.Map;
import java.util.Objects;
import java.util.Set;

/**
 * Background knowledge about the causal structure: required directed edges, forbidden
 * directed edges, and tiers of a temporal order (no edge may point from a later tier to an
 * earlier one). Immutable; contradictions are refused when it is built.
 *
 * <p>This is the kind of knowledge honoured by PC and FCI (Spirtes, Glymour and Scheines
 * 2000, §5.8) and by Meek's rules with background knowledge (Meek 1995).
 */
public final class Knowledge {

    private static final Knowledge NONE = new Knowledge(Set.of(), Set.of(), List.of());

    private final Set<DirectedPair> required;
    private final Set<DirectedPair> forbidden;
    private final List<List<String>> tiers;
    private final Map<String, Integer> tierOf;

    private Knowledge(Set<DirectedPair> required, Set<DirectedPair> forbidden, List<List<String>> tiers) {
        this.required = Collections.unmodifiableSet(new LinkedHashSet<>(required));
        this.forbidden = Collections.unmodifiableSet(new LinkedHashSet<>(forbidden));
        List<List<String>> t = new ArrayList<>();
        Map<String, Integer> map = new HashMap<>();
        for (int i = 0; i < tiers.size(); i++) {
            t.add(List.copyOf(tiers.get(i)));
            for (String v : tiers.get(i)) {
                map.put(v, i);
            }
        }
        this.tiers = Collections.unmodifiableList(t);
        this.tierOf = map;
    }

    /** Knowledge that constrains nothing. */
    public static Knowledge none() {
        return NONE;
    }

    public static Builder builder() {
        return new Builder();
    }

    /** A builder holding this knowledge (its required and forbidden edges, then its tiers), to add to. */
    public Builder toBuilder() {
        Builder b = new Builder();
        required().forEach(r -> b.require(r.from(), r.to()));
        forbidden().forEach(f -> b.forbid(f.from(), f.to()));
        tiers().forEach(b::tier);
        return b;
    }

    public boolean isEmpty() {
        return required.isEmpty() && forbidden.isEmpty() && tiers.isEmpty();
    }

    /** The required directed edges, in the order given. */
    public Set<DirectedPair> required() {
        return required;
    }

    /** The explicitly forbidden directed edges (tiers forbid more; see {@link #isForbidden}). */
    public Set<DirectedPair> forbidden() {
        return forbidden;
    }

    /** The tiers, earliest first. */
    public List<List<String>> tiers() {
        return tiers;
    }

    /** The tier of a variable (0 = earliest), or −1 if it is in none. */
    public int tierOf(String variable) {
        Integer t = tierOf.get(variable);
        return t == null ? -1 : t;
    }

    /** Whether {@code from → to} is forbidden, explicitly or because {@code from} is in a later tier. */
    public boolean isForbidden(String from, String to) {
        if (forbidden.contains(new DirectedPair(from, to))) {
            return true;
        }
        int tf = tierOf(from);
        int tt = tierOf(to);
        return tf >= 0 && tt >= 0 && tf > tt;
    }

    /** Whether {@code from → to} is required. */
    public boolean isRequired(String from, String to) {
        return required.contains(new DirectedPair(from, to));
    }

    /** Whether no edge at all may join the two variables (both directions forbidden). */
    public boolean isAdjacencyForbidden(String a, String b) {
        return isForbidden(a, b) && isForbidden(b, a);
    }

    /** Every variable the knowledge mentions. */
    public Set<String> variables() {
        Set<String> out = new LinkedHashSet<>();
        for (DirectedPair p : required) {
            out.add(p.from());
            out.add(p.to());
        }
        for (DirectedPair p : forbidden) {
            out.add(p.from());
            out.add(p.to());
        }
        for (List<String> t : tiers) {
            out.addAll(t);
        }
        return out;
    }

    /**
     * Checks that every variable named is one of {@code names}.
     *
     * @throws IllegalArgumentException naming the first unknown variable
     */
    public void checkVariables(List<String> names) {
        Set<String> known = new HashSet<>(names);
        for (String v : variables()) {
            if (!known.contains(v)) {
                throw new IllegalArgumentException("knowledge names variable '" + v + "', which the data do not have");
            }
        }
    }

    /** A directed pair of variable names. */
    public record DirectedPair(String from, String to) {
        public DirectedPair {
            Objects.requireNonNull(from, "from");
            Objects.requireNonNull(to, "to");
            if (from.equals(to)) {
                throw new IllegalArgumentException("an edge from '" + from + "' to itself makes no sense");
            }
        }

        @Override
        public String toString() {
            return from + " -> " + to;
        }
    }

    /** Collects knowledge and checks it for contradictions in {@link #build()}. */
    public static final class Builder {
        private final Set<DirectedPair> required = new LinkedHashSet<>();
        private final Set<DirectedPair> forbidden = new LinkedHashSet<>();
        private final List<List<String>> tiers = new ArrayList<>();

        private Builder() {
        }

        public Builder require(String from, String to) {
            required.add(new DirectedPair(from, to));
            return this;
        }

        public Builder forbid(String from, String to) {
            forbidden.add(new DirectedPair(from, to));
            return this;
        }

        /** Adds the next tier (later than all tiers added before). */
        public Builder tier(List<String> variables) {
            tiers.add(List.copyOf(variables));
            return this;
        }

        /**
         * The knowledge.
         *
         * @throws IllegalArgumentException for a variable in two tiers, an edge both required
         *     and forbidden (explicitly or by tiers), a required edge in both directions, or a
         *     cycle of required edges; the message names the edges involved
         */
        public Knowledge build() {
            Map<String, Integer> seen = new HashMap<>();
            for (int i = 0; i < tiers.size(); i++) {
                for (String v : tiers.get(i)) {
                    Integer prev = seen.put(v, i);
                    if (prev != null && prev == i) {
                        throw new IllegalArgumentException("variable '" + v + "' appears twice in tier " + (i + 1));
                    }
                    if (prev != null) {
                        throw new IllegalArgumentException("variable '" + v + "' is in tier " + (prev + 1)
                                + " and tier " + (i + 1));
                    }
                }
            }
            Knowledge k = new Knowledge(required, forbidden, tiers);
            for (DirectedPair p : required) {
                if (forbidden.contains(p)) {
                    throw new IllegalArgumentException("edge " + p + " is both required and forbidden");
                }
                if (k.isForbidden(p.from(), p.to())) {
                    throw new IllegalArgumentException("required edge " + p + " points from tier "
                            + (k.tierOf(p.from()) + 1) + " back to tier " + (k.tierOf(p.to()) + 1));
                }
            }
            List<String> cycle = requiredCycle();
            if (!cycle.isEmpty()) {
                throw new IllegalArgumentException("required edges form a cycle: " + String.join(" -> ", cycle));
            }
            return k;
        }

        private List<String> requiredCycle() {
            Map<String, List<String>> out = new HashMap<>();
            for (DirectedPair p : required) {
                out.computeIfAbsent(p.from(), x -> new ArrayList<>()).add(p.to());
            }
            Map<String, Integer> state = new HashMap<>();
            for (String start : out.keySet()) {
                if (state.containsKey(start)) {
                    continue;
                }
                Deque<String> path = new ArrayDeque<>();
                List<String> found = visit(start, out, state, path);
                if (!found.isEmpty()) {
                    return found;
                }
            }
            return List.of();
        }

        private static List<String> visit(String v, Map<String, List<String>> out, Map<String, Integer> state,
                                          Deque<String> path) {
            state.put(v, 1);
            path.addLast(v);
            for (String w : out.getOrDefault(v, List.of())) {
                Integer s = state.get(w);
                if (s == null) {
                    List<String> found = visit(w, out, state, path);
                    if (!found.isEmpty()) {
                        return found;
                    }
                } else if (s == 1) {
                    List<String> cycle = new ArrayList<>();
                    boolean on = false;
                    for (String u : path) {
                        on |= u.equals(w);
                        if (on) {
                            cycle.add(u);
                        }
                    }
                    cycle.add(w);
                    return cycle;
                }
            }
            path.removeLast();
            state.put(v, 2);
            return List.of();
        }
    }
}

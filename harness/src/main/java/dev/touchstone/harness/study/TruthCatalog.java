package dev.touchstone.harness.study;

import dev.touchstone.core.param.ParameterSpec;

import java.util.List;

/**
 * What the {@code truth} section of a study may say: its sub-sections (network, graph,
 * model, hidden, missing), the kinds each allows and their declared parameters. The study reader,
 * the expansion and the generated reference page all read these descriptors, so they
 * cannot disagree. Implemented over the generators' registries.
 */
public interface TruthCatalog {

    /** The sub-sections of {@code truth}, in the order they are applied. */
    List<Section> sections();

    /**
     * Checks one complete combination across sections (e.g. more hidden variables than
     * nodes), beyond what each parameter's range can say.
     *
     * @throws IllegalArgumentException with a message naming the fields involved
     */
    default void checkCombination(TruthSetting setting) {
    }

    /**
     * Checks and binds a value that refers to something outside the study file (for example
     * a graph file named relative to the study's folder), returning the value to keep.
     *
     * @param baseDir the folder of the study file, against which relative paths resolve
     * @throws IllegalArgumentException with a one-line message when the value cannot be used
     */
    default Object bind(String section, String kind, String parameter, Object value, java.nio.file.Path baseDir) {
        return value;
    }

    /**
     * What else defines a choice beyond its parameter values (for example a digest of the
     * graph file it names), so that run keys change when it changes; "" for nothing.
     */
    default String fingerprint(String section, String kind, dev.touchstone.core.param.ParameterValues values) {
        return "";
    }

    /**
     * The parameters of a kind that only locate the content its {@link #fingerprint} digests
     * (for example a graph file's path): run keys and seeds use the fingerprint instead.
     */
    default java.util.Set<String> locations(String section, String kind) {
        return java.util.Set.of();
    }

    /** The section with this name, or null. */
    default Section section(String name) {
        for (Section s : sections()) {
            if (s.name().equals(name)) {
                return s;
            }
        }
        return null;
    }

    /**
     * One sub-section of {@code truth}.
     *
     * @param name        its key, e.g. {@code graph}
     * @param kindField   the key naming the kind inside it, e.g. {@code family}
     * @param defaultKind the kind used when the section is left out, or null when it is required
     * @param shorthandKind the kind meant when the section is given as a bare value or list, or null
     * @param shorthand   the parameter of {@code shorthandKind} such a bare value sets
     *                    ({@code hidden: 2} meaning {@code hidden: {kind: random, count: 2}}), or null
     *                    ({@code hidden: 2} meaning {@code hidden: {kind: random, count: 2}}); equal to
     *                    {@code kindField} when a bare value names the kind itself
     *                    ({@code network: sprinkler})
     * @param meaning     one line for the reference page
     * @param kinds       the allowed kinds
     * @param replaces    sections this one stands in for: when it is given they must be left out
     *                    and are not required; when it is left out it is absent (it has no default)
     */
    record Section(String name, String kindField, String defaultKind, String shorthandKind, String shorthand,
                   String meaning,
                   List<Kind> kinds, List<String> replaces) {
        public Section {
            kinds = List.copyOf(kinds);
            replaces = List.copyOf(replaces);
        }

        public Section(String name, String kindField, String defaultKind, String shorthandKind, String shorthand,
                       String meaning, List<Kind> kinds) {
            this(name, kindField, defaultKind, shorthandKind, shorthand, meaning, kinds, List.of());
        }

        /** Whether a bare value names the kind ({@code network: sprinkler}). */
        public boolean bareValueIsKind() {
            return kindField.equals(shorthand);
        }

        /** Whether the section may be left out with nothing in its place. */
        public boolean optional() {
            return !replaces.isEmpty();
        }

        public Kind kind(String name) {
            for (Kind k : kinds) {
                if (k.name().equals(name)) {
                    return k;
                }
            }
            return null;
        }

        public List<String> kindNames() {
            return kinds.stream().map(Kind::name).toList();
        }
    }

    /** One allowed kind of a section with its declared parameters. */
    record Kind(String name, String summary, List<ParameterSpec> parameters) {
        public Kind {
            parameters = List.copyOf(parameters);
        }

        public ParameterSpec parameter(String name) {
            for (ParameterSpec p : parameters) {
                if (p.name().equals(name)) {
                    return p;
                }
            }
            return null;
        }
    }
}

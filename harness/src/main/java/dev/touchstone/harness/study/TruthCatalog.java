package dev.touchstone.harness.study;

import dev.touchstone.core.param.ParameterSpec;

import java.util.List;

/**
 * What the {@code truth} section of a study may say: its sub-sections (graph, model,
 * hidden, missing), the kinds each allows and their declared parameters. The study reader,
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
     * @param meaning     one line for the reference page
     * @param kinds       the allowed kinds
     */
    record Section(String name, String kindField, String defaultKind, String shorthandKind, String shorthand,
                   String meaning,
                   List<Kind> kinds) {
        public Section {
            kinds = List.copyOf(kinds);
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

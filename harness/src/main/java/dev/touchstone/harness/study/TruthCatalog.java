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

    /**
     * The choice of a kind with these values, with its {@link #fingerprint} and {@link #locations}:
     * how a study's expansion and the command line's truth options alike make a choice, so their
     * seeds agree.
     *
     * @param given the values that were written (for output columns)
     */
    default TruthSetting.Choice choice(String section, String kind, dev.touchstone.core.param.ParameterValues values,
                                       java.util.Map<String, Object> given) {
        return new TruthSetting.Choice(section, kind, values, given,
                new TruthSetting.External(fingerprint(section, kind, values), locations(section, kind)));
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
     * One sub-section of {@code truth}; made with {@link #builder}. Immutable.
     *
     * <p>Its parts: {@code name}, its key ({@code graph}); {@code kindField}, the key naming the kind
     * inside it ({@code family}); {@code defaultKind}, the kind used when the section is left out,
     * or null when it is required; {@code shorthandKind}, the kind meant when the section is given
     * as a bare value or list, or null, and {@code shorthand}, the parameter of that kind such a bare
     * value sets ({@code hidden: 2} meaning {@code hidden: {kind: random, count: 2}}), or null; equal
     * to {@code kindField} when a bare value names the kind itself ({@code network: sprinkler});
     * {@code meaning}, one line for the reference page; {@code kinds}, the allowed kinds; and
     * {@code replaces}, the sections this one stands in for: when it is given they must be left out
     * and are not required; when it is left out it is absent (it has no default).
     */
    final class Section {
        private final String name;
        private final String kindField;
        private final String defaultKind;
        private final String shorthandKind;
        private final String shorthand;
        private final String meaning;
        private final List<Kind> kinds;
        private final List<String> replaces;

        private Section(Builder b) {
            this.name = java.util.Objects.requireNonNull(b.name, "name");
            this.kindField = java.util.Objects.requireNonNull(b.kindField, "kindField");
            this.defaultKind = b.defaultKind;
            this.shorthandKind = b.shorthandKind;
            this.shorthand = b.shorthand;
            this.meaning = b.meaning;
            this.kinds = List.copyOf(b.kinds);
            this.replaces = List.copyOf(b.replaces);
        }

        /** A section with this key whose kind is named by {@code kindField}; required, no shorthand, no kinds yet. */
        public static Builder builder(String name, String kindField) {
            return new Builder(name, kindField);
        }

        public String name() {
            return name;
        }

        public String kindField() {
            return kindField;
        }

        public String defaultKind() {
            return defaultKind;
        }

        public String shorthandKind() {
            return shorthandKind;
        }

        public String shorthand() {
            return shorthand;
        }

        public String meaning() {
            return meaning;
        }

        public List<Kind> kinds() {
            return kinds;
        }

        public List<String> replaces() {
            return replaces;
        }

        /** Collects the parts of a section. */
        public static final class Builder {
            private final String name;
            private final String kindField;
            private String defaultKind;
            private String shorthandKind;
            private String shorthand;
            private String meaning = "";
            private List<Kind> kinds = List.of();
            private List<String> replaces = List.of();

            private Builder(String name, String kindField) {
                this.name = name;
                this.kindField = kindField;
            }

            /** The kind used when the section is left out. */
            public Builder defaultKind(String kind) {
                this.defaultKind = kind;
                return this;
            }

            /** A bare value means {@code kind} (null when it names the kind) with {@code parameter} set to it. */
            public Builder shorthand(String kind, String parameter) {
                this.shorthandKind = kind;
                this.shorthand = parameter;
                return this;
            }

            /** One line for the reference page. */
            public Builder meaning(String line) {
                this.meaning = line;
                return this;
            }

            public Builder kinds(List<Kind> allowed) {
                this.kinds = allowed;
                return this;
            }

            /** The sections this one stands in for. */
            public Builder replaces(List<String> sections) {
                this.replaces = sections;
                return this;
            }

            public Section build() {
                return new Section(this);
            }
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

package dev.touchstone.harness.study;

import dev.touchstone.core.param.ParameterValues;

import java.util.List;
import java.util.Map;

/**
 * One point of the truth grid: for every truth section, its kind and the complete
 * parameter values (defaults filled in). Its {@link #canonical()} text is what seeds and
 * run keys are derived from. Immutable.
 *
 * @param index   position in the expansion's list of truth settings
 * @param choices one choice per section, in the catalogue's order
 */
public record TruthSetting(int index, List<Choice> choices) {

    public TruthSetting {
        choices = List.copyOf(choices);
    }

    /**
     * A section's kind and values. {@code given} holds only the values the study wrote (for
     * output columns); {@code external} is what defines content the choice names outside the
     * study file (a graph file), {@link External#NONE} for nothing.
     */
    public record Choice(String section, String kind, ParameterValues values, Map<String, Object> given,
                         External external) {
        public Choice {
            given = Map.copyOf(given);
            external = external == null ? External.NONE : external;
        }

        /** A choice naming nothing outside the study file. */
        public Choice(String section, String kind, ParameterValues values, Map<String, Object> given) {
            this(section, kind, values, given, External.NONE);
        }

        /** What else defines the choice (e.g. a digest of a graph file), "" for nothing. */
        public String fingerprint() {
            return external.fingerprint();
        }

        /** The parameters that only say where the fingerprinted content lives. */
        public java.util.Set<String> locations() {
            return external.locations();
        }

        /** E.g. {@code graph=erdos-renyi{nodes=20,mean_degree=2.0}}. */
        public String canonical() {
            StringBuilder sb = new StringBuilder(section).append('=').append(kind).append('{');
            boolean first = true;
            for (Map.Entry<String, Object> e : values.asMap().entrySet()) {
                if (locations().contains(e.getKey())) {
                    continue;
                }
                if (!first) {
                    sb.append(',');
                }
                first = false;
                sb.append(e.getKey()).append('=').append(Canonical.value(e.getValue()));
            }
            sb.append('}');
            return fingerprint().isEmpty() ? sb.toString() : sb.append('#').append(fingerprint()).toString();
        }
    }

    /**
     * Content a choice names outside the study file: {@code fingerprint} is its digest, "" for
     * nothing; {@code locations} names the parameters that only say where it lives (a file path).
     * Those are left out of the canonical text, so that moving a study with its graph file to
     * another folder keeps its run keys and seeds.
     */
    public record External(String fingerprint, java.util.Set<String> locations) {

        /** Nothing outside the study file. */
        public static final External NONE = new External("", java.util.Set.of());

        public External {
            locations = java.util.Set.copyOf(locations);
        }
    }

    /** The choice of this section, or null. */
    public Choice choice(String section) {
        for (Choice c : choices) {
            if (c.section().equals(section)) {
                return c;
            }
        }
        return null;
    }

    /** Every section's canonical text joined by {@code ;}. */
    public String canonical() {
        return canonicalUpTo(choices.size());
    }

    /** The canonical text of the first {@code count} sections (what that section's random draw may depend on). */
    public String canonicalUpTo(int count) {
        StringBuilder sb = new StringBuilder();
        for (int i = 0; i < count; i++) {
            if (i > 0) {
                sb.append(';');
            }
            sb.append(choices.get(i).canonical());
        }
        return sb.toString();
    }

    /** A short human label: each section's kind and the values the study varied or gave. */
    public String label() {
        return text(false);
    }

    /**
     * Like {@link #label()} with each section named and the sections separated by commas, for
     * a line that shows one truth alone: {@code graph erdos-renyi nodes=8, model linear-gaussian, hidden none}.
     */
    public String description() {
        return text(true);
    }

    private String text(boolean sections) {
        StringBuilder sb = new StringBuilder();
        for (Choice c : choices) {
            if (sb.length() > 0) {
                sb.append(sections ? ", " : " ");
            }
            if (sections) {
                sb.append(c.section()).append(' ');
            }
            sb.append(c.kind());
            for (Map.Entry<String, Object> e : c.values().asMap().entrySet()) {
                if (c.given().containsKey(e.getKey())) {
                    sb.append(' ').append(e.getKey()).append('=').append(Canonical.value(e.getValue()));
                }
            }
        }
        return sb.toString();
    }
}

package dev.touchstone.learners.independence;

import java.util.List;
import java.util.Locale;

/** How independence tests treat rows with missing cells. */
public enum MissingPolicy {
    /** Each test uses the rows complete for its own variables (Tu et al. 2019, "Causal discovery in the presence of missing data", AISTATS). */
    TEST_WISE,
    /** Every row with any missing cell is dropped before testing (list-wise deletion, the naive baseline). */
    LIST_WISE;

    public String word() {
        return name().toLowerCase(Locale.ROOT).replace('_', '-');
    }

    /** The words of all policies, for parameter declarations. */
    public static List<String> words() {
        return List.of(TEST_WISE.word(), LIST_WISE.word());
    }

    /** The policy named by {@code word} (as produced by {@link #word()}). */
    public static MissingPolicy parse(String word) {
        for (MissingPolicy m : values()) {
            if (m.word().equals(word)) {
                return m;
            }
        }
        throw new IllegalArgumentException("unknown missing-value policy '" + word + "' (allowed: "
                + String.join(", ", words()) + ")");
    }
}

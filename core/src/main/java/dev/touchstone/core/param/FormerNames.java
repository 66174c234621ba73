package dev.touchstone.core.param;

import java.util.Collection;
import java.util.Map;

/**
 * Spellings of parameter names and choice values that earlier versions accepted and that
 * were renamed, each with its new spelling. They are refused, never silently mapped: a
 * study or command line that still uses one gets the usual "unknown" message with a hint
 * naming the new spelling, so that results are never produced under a name whose meaning
 * a reader cannot look up in the current docs.
 */
public final class FormerNames {

    /** Old spelling → new spelling. */
    private static final Map<String, String> RENAMED = Map.ofEntries(
            // conditional Gaussian test and score (Andrews, Ramsey and Cooper 2018), spelled out
            Map.entry("cg-lrt", "conditional-gaussian"),
            Map.entry("cg-bic", "conditional-gaussian-bic"),
            // score-search parameters, named by what they do
            Map.entry("max_parents", "parent_limit"),
            Map.entry("ess", "equivalent_sample_size"),
            Map.entry("tabu_length", "recent_moves_barred"),
            Map.entry("restarts", "perturbed_starts"),
            Map.entry("perturbation", "random_moves_per_start"),
            // NOTEARS' stopping rules, named by what they bound
            Map.entry("h_tolerance", "acyclicity_tolerance"),
            Map.entry("rho_max", "penalty_limit"),
            // the skeleton search that removes an edge at once, named by how it visits pairs
            Map.entry("original", "sequential"));

    private FormerNames() {
    }

    /**
     * A hint for an unknown word: {@code " ('old' was renamed 'new')"} when the word is a
     * former spelling whose new spelling is among {@code allowed}, otherwise empty.
     */
    public static String hint(String word, Collection<String> allowed) {
        String now = word == null ? null : RENAMED.get(word.trim());
        return now != null && allowed.contains(now) ? " ('" + word.trim() + "' was renamed '" + now + "')" : "";
    }
}

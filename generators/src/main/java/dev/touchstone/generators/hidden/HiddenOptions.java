package dev.touchstone.generators.hidden;

import dev.touchstone.core.graph.Graph;
import dev.touchstone.core.param.ParameterSpec;
import dev.touchstone.core.param.ParameterValues;
import dev.touchstone.core.random.Shuffles;
import dev.touchstone.generators.Registry;
import org.apache.commons.rng.UniformRandomProvider;

import java.util.ArrayList;
import java.util.LinkedHashSet;
import java.util.List;
import java.util.Set;

/**
 * The built-in hidden-variable options: {@code none} (keep the DAG's flags as they are),
 * {@code random} (hide k variables chosen uniformly) and {@code confounders} (hide k
 * variables chosen uniformly among those with at least two children, the common causes
 * whose omission creates bidirected edges in the MAG; Richardson and Spirtes 2002).
 * When fewer variables qualify than asked for, all that qualify are hidden; the truth's
 * {@code hiddenNames()} says how many were. Cost O(p + edges).
 */
public final class HiddenOptions {

    public static final String NONE = "none";
    public static final String RANDOM = "random";
    public static final String CONFOUNDERS = "confounders";

    static final ParameterSpec COUNT = ParameterSpec.integer("count", 1, 0, 1_000_000,
            "number of variables to hide");

    private static final List<HiddenOption> ALL = List.of(
            new Option(NONE, "hide nothing (a given graph keeps its own flags)", List.of(), false, false),
            new Option(RANDOM, "hide variables chosen uniformly at random", List.of(COUNT), true, false),
            new Option(CONFOUNDERS, "hide only common causes (variables with at least two children)",
                    List.of(COUNT), true, true));

    private HiddenOptions() {
    }

    public static List<HiddenOption> all() {
        return ALL;
    }

    /**
     * The option with this id.
     *
     * @throws IllegalArgumentException naming the id and listing the known ones
     */
    public static HiddenOption byId(String id) {
        return Registry.byId(ALL, HiddenOption::id, "hidden option", id);
    }

    private record Option(String id, String summary, List<ParameterSpec> parameters, boolean hides,
                          boolean confoundersOnly) implements HiddenOption {

        @Override
        public Graph apply(Graph dag, ParameterValues values, UniformRandomProvider random) {
            if (!hides) {
                return dag;
            }
            int k = values.getInt(COUNT.name());
            if (!confoundersOnly && k >= dag.size()) {
                throw new dev.touchstone.core.param.ParameterException(COUNT.name(), "parameter 'count': hiding " + k
                        + " of " + dag.size() + " variables would leave none observed");
            }
            List<Integer> eligible = new ArrayList<>();
            for (int v = 0; v < dag.size(); v++) {
                if (!confoundersOnly || dag.children(v).length >= 2) {
                    eligible.add(v);
                }
            }
            // The first k of the list become a uniform choice.
            int take = Math.min(k, eligible.size());
            Shuffles.shuffleHead(random, eligible, take);
            Set<String> hidden = new LinkedHashSet<>();
            for (int i = 0; i < take; i++) {
                hidden.add(dag.name(eligible.get(i)));
            }
            return dag.withHidden(hidden);
        }
    }
}

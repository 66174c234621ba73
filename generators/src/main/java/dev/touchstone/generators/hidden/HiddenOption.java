package dev.touchstone.generators.hidden;

import dev.touchstone.core.graph.Graph;
import dev.touchstone.core.param.ParameterSpec;
import dev.touchstone.core.param.ParameterValues;
import org.apache.commons.rng.UniformRandomProvider;

import java.util.List;
import java.util.Map;

/**
 * A way of choosing which variables of the true DAG are hidden (latent). The data omit
 * hidden variables; the truth keeps them, flagged ({@link Graph#withHidden}), so that the
 * MAG and PAG over the observed variables can be derived.
 */
public interface HiddenOption {

    /** The identifier used in study files, e.g. {@code confounders}. */
    String id();

    String summary();

    List<ParameterSpec> parameters();

    /**
     * The DAG with the chosen variables flagged hidden (and all others observed).
     *
     * @param random the source of the choice (owned by the caller)
     */
    Graph apply(Graph dag, ParameterValues values, UniformRandomProvider random);

    default ParameterValues resolve(Map<String, ?> raw) {
        return ParameterValues.resolve("hidden option " + id(), parameters(), raw);
    }
}

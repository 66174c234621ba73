package dev.touchstone.generators.graphs;

import dev.touchstone.core.param.ParameterSpec;
import dev.touchstone.core.param.ParameterValues;
import org.apache.commons.rng.UniformRandomProvider;

import java.util.List;
import java.util.Map;

/**
 * A family of true DAGs: a random construction (or a given graph) with declared parameters.
 * Study files, the command line and listings read the same {@link #parameters()}.
 *
 * <p>Random families name their variables {@code X1 … Xp} in column order and build the
 * DAG along a random permutation of those names, so that a variable's column position
 * never reveals its place in the causal order.
 */
public interface GraphFamily {

    /** The identifier used in study files, e.g. {@code erdos-renyi}. */
    String id();

    /** One line saying what the family produces. */
    String summary();

    /** The publication the construction follows (or "common practice"). */
    String publication();

    /** The declared parameters, including {@code nodes} for random families. */
    List<ParameterSpec> parameters();

    /**
     * Draws one graph.
     *
     * @param values checked values of {@link #parameters()} (see {@link #resolve(Map)})
     * @param random the source of every random choice (owned by the caller)
     * @throws dev.touchstone.core.param.ParameterException when values break a cross-field rule
     */
    GeneratedGraph generate(ParameterValues values, UniformRandomProvider random);

    /** Checks raw values (from a study file or the command line) against {@link #parameters()}. */
    default ParameterValues resolve(Map<String, ?> raw) {
        return ParameterValues.resolve("graph family " + id(), parameters(), raw);
    }
}

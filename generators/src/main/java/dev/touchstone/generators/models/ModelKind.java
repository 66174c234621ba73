package dev.touchstone.generators.models;

import dev.touchstone.core.data.DataKind;
import dev.touchstone.core.graph.Graph;
import dev.touchstone.core.param.ParameterSpec;
import dev.touchstone.core.param.ParameterValues;
import org.apache.commons.rng.UniformRandomProvider;

import java.util.List;
import java.util.Map;

/**
 * A kind of structural-equation model with declared parameters. {@link #draw} fixes every
 * parameter of one model for a given DAG (weights, functions, tables, scales); the model
 * then samples data sets of any size.
 */
public interface ModelKind {

    /** The identifier used in study files, e.g. {@code linear-gaussian}. */
    String id();

    /** One line saying what the model is. */
    String summary();

    /** The publication the model follows (or "common practice"). */
    String publication();

    /** The kind of data the model produces. */
    DataKind produces();

    /** The declared parameters. */
    List<ParameterSpec> parameters();

    /**
     * Draws every parameter of one model for {@code dag}.
     *
     * @param dag    the true DAG (all edges directed), hidden variables flagged
     * @param values checked values of {@link #parameters()}
     * @param random the source of every random choice of the parameters (owned by the caller)
     */
    StructuralModel draw(Graph dag, ParameterValues values, UniformRandomProvider random);

    /** Checks raw values (from a study file or the command line) against {@link #parameters()}. */
    default ParameterValues resolve(Map<String, ?> raw) {
        return ParameterValues.resolve("model " + id(), parameters(), raw);
    }
}

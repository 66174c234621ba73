package dev.touchstone.generators.models;

import dev.touchstone.core.graph.Graph;
import dev.touchstone.core.param.ParameterValues;
import org.apache.commons.rng.UniformRandomProvider;

/** Drawing models of this kind (implementation pending). */
final class NonlinearModels {

    private NonlinearModels() {
    }

    static StructuralModel draw(String kindId, Graph dag, ParameterValues values, UniformRandomProvider random) {
        throw new UnsupportedOperationException("model kind '" + kindId + "' is not implemented yet");
    }
}

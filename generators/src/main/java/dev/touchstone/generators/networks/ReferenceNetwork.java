package dev.touchstone.generators.networks;

import dev.touchstone.core.graph.Graph;
import dev.touchstone.generators.models.StructuralModel;

import java.util.Objects;

/**
 * A built-in truth with fixed parameters: a DAG, its model, where it comes from and what
 * to keep in mind when using it.
 *
 * @param id     the identifier used in study files and on the command line
 * @param title  a short human title
 * @param source the publication it follows, or a note that it is invented or illustrative
 * @param notes  caveats (e.g. deterministic nodes that break faithfulness)
 * @param model  the model; {@code model.graph()} is the DAG
 */
public record ReferenceNetwork(String id, String title, String source, String notes, StructuralModel model) {

    public ReferenceNetwork {
        Objects.requireNonNull(id, "id");
        Objects.requireNonNull(model, "model");
    }

    /** The true DAG. */
    public Graph dag() {
        return model.graph();
    }
}

package dev.touchstone.generators.models;

import dev.touchstone.generators.Registry;

import java.util.List;

/** The registry of built-in model kinds, in listing order. */
public final class ModelKinds {

    private static final List<ModelKind> ALL = List.of(new LinearGaussianKind(), new LinearNonGaussianKind(),
            new AdditiveNonlinearKind(), new DiscreteNetworkKind(), new ConditionalGaussianKind());

    private ModelKinds() {
    }

    public static List<ModelKind> all() {
        return ALL;
    }

    /**
     * The kind with this id.
     *
     * @throws IllegalArgumentException naming the id and listing the known ones
     */
    public static ModelKind byId(String id) {
        return Registry.byId(ALL, ModelKind::id, "model kind", id);
    }
}

package dev.touchstone.generators.models;

import java.util.ArrayList;
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
        for (ModelKind k : ALL) {
            if (k.id().equals(id)) {
                return k;
            }
        }
        List<String> known = new ArrayList<>();
        for (ModelKind k : ALL) {
            known.add(k.id());
        }
        throw new IllegalArgumentException("unknown model kind '" + id + "' (known: " + String.join(", ", known) + ")");
    }
}

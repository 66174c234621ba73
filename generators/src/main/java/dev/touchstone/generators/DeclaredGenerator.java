package dev.touchstone.generators;

import dev.touchstone.core.param.ParameterSpec;

import java.util.List;
import java.util.Objects;

/**
 * What every built-in graph family and model kind declares about itself, held once: its id
 * in study files, a one-line summary, the publication of the method, and its parameters in
 * listing order (which the study reference and the {@code generators} listing show).
 * Subclasses pass these to the constructor and implement only their generator.
 */
public abstract class DeclaredGenerator {

    private final String id;
    private final String summary;
    private final String publication;
    private final List<ParameterSpec> parameters;

    protected DeclaredGenerator(String id, String summary, String publication, List<ParameterSpec> parameters) {
        this.id = Objects.requireNonNull(id, "id");
        this.summary = Objects.requireNonNull(summary, "summary");
        this.publication = Objects.requireNonNull(publication, "publication");
        this.parameters = List.copyOf(parameters);
    }

    /** The id in study files. */
    public final String id() {
        return id;
    }

    /** One line on what it generates. */
    public final String summary() {
        return summary;
    }

    /** The publication of the method, or "common practice". */
    public final String publication() {
        return publication;
    }

    /** The declared parameters, in listing order. */
    public final List<ParameterSpec> parameters() {
        return parameters;
    }
}

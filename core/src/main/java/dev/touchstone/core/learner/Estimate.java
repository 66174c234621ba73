package dev.touchstone.core.learner;

import dev.touchstone.core.graph.Graph;
import dev.touchstone.core.graph.GraphClass;

import java.util.Map;
import java.util.Objects;

/**
 * What a learner returned: a graph over the input's variables and the class it claims to
 * be, with optional named numbers the learner wants recorded (e.g. a final score).
 */
public record Estimate(Graph graph, GraphClass graphClass, Map<String, Double> extras) {

    public Estimate {
        Objects.requireNonNull(graph, "graph");
        Objects.requireNonNull(graphClass, "graphClass");
        extras = extras == null ? Map.of() : Map.copyOf(extras);
        for (var e : graph.edges()) {
            if (!graphClass.allows(e)) {
                throw new IllegalArgumentException("a " + graphClass.word() + " cannot have the edge "
                        + graph.name(e.a()) + " " + e.atA().word() + "/" + e.atB().word() + " " + graph.name(e.b()));
            }
        }
    }

    public static Estimate of(Graph graph, GraphClass graphClass) {
        return new Estimate(graph, graphClass, Map.of());
    }
}

package dev.touchstone.generators;

import dev.touchstone.core.data.DataSet;
import dev.touchstone.core.graph.Graph;
import dev.touchstone.core.knowledge.Knowledge;
import dev.touchstone.core.param.ParameterValues;
import dev.touchstone.core.random.Seeds;
import dev.touchstone.generators.graphs.GeneratedGraph;
import dev.touchstone.generators.graphs.GraphFamily;
import dev.touchstone.generators.hidden.HiddenOption;
import dev.touchstone.generators.hidden.HiddenOptions;
import dev.touchstone.generators.missing.MissingnessMechanism;
import dev.touchstone.generators.missing.MissingnessMechanisms;
import dev.touchstone.generators.missing.MissingnessPlan;
import dev.touchstone.generators.models.ModelKind;
import dev.touchstone.generators.models.ModelOptions;
import dev.touchstone.generators.models.StructuralModel;
import dev.touchstone.generators.networks.ReferenceNetwork;

import java.util.ArrayList;
import java.util.List;
import java.util.Map;
import java.util.Objects;
import java.util.Set;

/**
 * The recipe of a setting's truth: a graph family and model kind with their values (or a
 * reference network), a hidden-variable option and a missingness mechanism. Immutable.
 *
 * <p>{@link #drawTruth(long)} turns a replicate seed into one {@link SimulatedTruth}.
 * Every random choice comes from a stream derived from that seed and its purpose
 * ({@code "graph"}, {@code "hidden"}, {@code "model"}, {@code "missing"},
 * {@code "missing-pilot"}, {@code "data"}), never from order of execution, so changing
 * the missingness leaves graph, parameters and data values as they were, and one
 * replicate's seed never affects another's.
 */
public final class Simulation {

    private final GraphFamily family;
    private final ParameterValues graphValues;
    private final ModelKind kind;
    private final ParameterValues modelValues;
    private final ReferenceNetwork network;
    private final TruthParameters fixed;
    /** The truth {@link #fixed} describes, built once: replicates differ only in their data seed. */
    private final SimulatedTruth fixedTruth;
    private final HiddenOption hidden;
    private final ParameterValues hiddenValues;
    private final MissingnessMechanism missing;
    private final ParameterValues missingValues;

    private Simulation(Builder b) {
        this.family = b.family;
        this.graphValues = b.graphValues;
        this.kind = b.kind;
        this.modelValues = b.modelValues;
        this.network = b.network;
        this.fixed = b.fixed;
        this.fixedTruth = b.fixed == null ? null : b.fixed.truth();
        this.hidden = b.hidden;
        this.hiddenValues = b.hiddenValues;
        this.missing = b.missing;
        this.missingValues = b.missingValues;
    }

    public static Builder builder() {
        return new Builder();
    }

    /** The reference network used instead of a family and kind, or null. */
    public ReferenceNetwork network() {
        return network;
    }

    /** The truth fixed by a model file, used instead of a family and kind or a network, or null. */
    public TruthParameters fixed() {
        return fixed;
    }

    public GraphFamily family() {
        return family;
    }

    public ModelKind kind() {
        return kind;
    }

    /**
     * Draws the truth of one replicate: graph, hidden flags, model parameters and missingness.
     * Deterministic in {@code replicateSeed}.
     */
    public SimulatedTruth drawTruth(long replicateSeed) {
        if (fixedTruth != null) {
            // every parameter is given (graph, hidden flags, mechanisms, missingness, tiers):
            // a replicate draws only its own data
            return fixedTruth.withDataSeed(Seeds.derive(replicateSeed, "data"));
        }
        Graph dag;
        Knowledge knowledge;
        List<String> order;
        StructuralModel model;
        if (network != null) {
            dag = hidden.apply(network.dag(), hiddenValues, Seeds.random(Seeds.derive(replicateSeed, "hidden")));
            model = network.model().withHidden(dag.hiddenNames());
            knowledge = Knowledge.none();
            order = topologicalNames(dag);
        } else {
            GeneratedGraph g = family.generate(graphValues, Seeds.random(Seeds.derive(replicateSeed, "graph")));
            dag = hidden.apply(g.dag(), hiddenValues, Seeds.random(Seeds.derive(replicateSeed, "hidden")));
            model = kind.draw(dag, modelValues, Seeds.random(Seeds.derive(replicateSeed, "model")));
            knowledge = observedOnly(g.knowledge(), dag.hiddenNames());
            order = g.causalOrder();
        }
        MissingnessPlan plan = MissingnessPlan.none();
        if (!missing.id().equals(MissingnessMechanisms.NONE)) {
            DataSet pilot = model.sampleComplete(ModelOptions.PILOT_ROWS, Seeds.derive(replicateSeed, "missing-pilot"));
            plan = missing.plan(dag, pilot, missingValues, Seeds.random(Seeds.derive(replicateSeed, "missing")));
        }
        return new SimulatedTruth(replicateSeed, dag, knowledge, order, model, plan,
                Seeds.derive(replicateSeed, "data"));
    }

    /** The variables' names in a topological order of {@code dag}. */
    static List<String> topologicalNames(Graph dag) {
        List<String> out = new ArrayList<>();
        for (int v : dev.touchstone.core.graph.algorithms.Ancestry.topologicalOrder(dag)) {
            out.add(dag.name(v));
        }
        return out;
    }

    /** Knowledge restricted to observed variables (tiers lose their hidden members). */
    static Knowledge observedOnly(Knowledge k, Set<String> hiddenNames) {
        if (k.isEmpty() || hiddenNames.isEmpty()) {
            return k;
        }
        Knowledge.Builder b = Knowledge.builder();
        for (List<String> tier : k.tiers()) {
            List<String> keep = new ArrayList<>(tier);
            keep.removeAll(hiddenNames);
            b.tier(keep);
        }
        for (Knowledge.DirectedPair p : k.required()) {
            if (!hiddenNames.contains(p.from()) && !hiddenNames.contains(p.to())) {
                b.require(p.from(), p.to());
            }
        }
        for (Knowledge.DirectedPair p : k.forbidden()) {
            if (!hiddenNames.contains(p.from()) && !hiddenNames.contains(p.to())) {
                b.forbid(p.from(), p.to());
            }
        }
        return b.build();
    }

    /**
     * Collects the parts. A family with a kind, a network, or a fixed truth is required; hidden defaults
     * to {@code none} and missingness to {@code none}.
     */
    public static final class Builder {
        private GraphFamily family;
        private ParameterValues graphValues;
        private ModelKind kind;
        private ParameterValues modelValues;
        private ReferenceNetwork network;
        private TruthParameters fixed;
        private HiddenOption hidden = HiddenOptions.byId(HiddenOptions.NONE);
        private ParameterValues hiddenValues = ParameterValues.none();
        private MissingnessMechanism missing = MissingnessMechanisms.byId(MissingnessMechanisms.NONE);
        private ParameterValues missingValues = ParameterValues.none();

        private Builder() {
        }

        public Builder graph(GraphFamily f, ParameterValues values) {
            this.family = Objects.requireNonNull(f, "family");
            this.graphValues = Objects.requireNonNull(values, "values");
            return this;
        }

        /** The family with raw values (checked against its declarations). */
        public Builder graph(GraphFamily f, Map<String, ?> raw) {
            return graph(f, f.resolve(raw));
        }

        public Builder model(ModelKind k, ParameterValues values) {
            this.kind = Objects.requireNonNull(k, "kind");
            this.modelValues = Objects.requireNonNull(values, "values");
            return this;
        }

        public Builder model(ModelKind k, Map<String, ?> raw) {
            return model(k, k.resolve(raw));
        }

        /**
         * A truth with every parameter fixed (as a model file gives it), instead of a family
         * and kind or a network; it carries its own hidden variables and missingness.
         */
        public Builder fixed(TruthParameters parameters) {
            this.fixed = Objects.requireNonNull(parameters, "parameters");
            return this;
        }

        public Builder network(ReferenceNetwork n) {
            this.network = Objects.requireNonNull(n, "network");
            return this;
        }

        public Builder hidden(HiddenOption h, ParameterValues values) {
            this.hidden = Objects.requireNonNull(h, "hidden");
            this.hiddenValues = Objects.requireNonNull(values, "values");
            return this;
        }

        public Builder hidden(HiddenOption h, Map<String, ?> raw) {
            return hidden(h, h.resolve(raw));
        }

        public Builder missing(MissingnessMechanism m, ParameterValues values) {
            this.missing = Objects.requireNonNull(m, "missing");
            this.missingValues = Objects.requireNonNull(values, "values");
            return this;
        }

        public Builder missing(MissingnessMechanism m, Map<String, ?> raw) {
            return missing(m, m.resolve(raw));
        }

        /**
         * The simulation.
         *
         * @throws IllegalStateException when neither a family with a kind nor a network was
         *     given, or both were
         */
        public Simulation build() {
            if (fixed != null) {
                if (network != null || family != null || kind != null) {
                    throw new IllegalStateException("a model file fixes the graph and the model: give no network,"
                            + " graph family or model kind with it");
                }
                if (!hidden.id().equals(HiddenOptions.NONE) || !missing.id().equals(MissingnessMechanisms.NONE)) {
                    throw new IllegalStateException("a model file carries its own hidden variables and missingness:"
                            + " give no hidden option or missingness mechanism with it");
                }
                return new Simulation(this);
            }
            if (network != null && (family != null || kind != null)) {
                throw new IllegalStateException("give either a network or a graph family and model kind, not both");
            }
            if (network == null && (family == null || kind == null)) {
                throw new IllegalStateException("a simulation needs a graph family and a model kind, or a network");
            }
            return new Simulation(this);
        }
    }
}

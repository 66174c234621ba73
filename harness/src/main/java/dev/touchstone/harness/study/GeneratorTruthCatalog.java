package dev.touchstone.harness.study;

import dev.touchstone.core.param.ParameterValues;
import dev.touchstone.generators.Simulation;
import dev.touchstone.generators.graphs.GivenGraphFamily;
import dev.touchstone.generators.graphs.GraphFamilies;
import dev.touchstone.generators.graphs.GraphFamily;
import dev.touchstone.generators.hidden.HiddenOption;
import dev.touchstone.generators.hidden.HiddenOptions;
import dev.touchstone.generators.missing.MissingnessMechanism;
import dev.touchstone.generators.missing.MissingnessMechanisms;
import dev.touchstone.generators.models.ModelKind;
import dev.touchstone.generators.models.ModelKinds;

import java.util.ArrayList;
import java.util.List;

/**
 * The truth catalogue over the generators' registries: {@code graph} (key {@code family}),
 * {@code model} ({@code kind}), {@code hidden} ({@code kind}, default {@code none};
 * {@code hidden: 2} means {@code {kind: random, count: 2}}) and {@code missing}
 * ({@code mechanism}, default {@code none}). Parameters are the generators' own
 * declarations, so study files, listings and the reference page follow them.
 *
 * <p>Cross-field rules are checked by building each setting's {@link Simulation} and drawing
 * one truth from a fixed seed, so a rule the generators enforce only when drawing (say, more
 * edges than a graph can hold) is reported before the study starts. Cost: one truth draw per
 * truth setting.
 */
public final class GeneratorTruthCatalog implements TruthCatalog {

    public static final String GRAPH = "graph";
    public static final String MODEL = "model";
    public static final String HIDDEN = "hidden";
    public static final String MISSING = "missing";

    private final List<Section> sections;

    public GeneratorTruthCatalog() {
        List<Kind> families = new ArrayList<>();
        for (GraphFamily f : GraphFamilies.all()) {
            if (!f.id().equals(GivenGraphFamily.ID)) { // needs a graph file, not yet wired to studies
                families.add(new Kind(f.id(), f.summary(), f.parameters()));
            }
        }
        List<Kind> models = new ArrayList<>();
        for (ModelKind k : ModelKinds.all()) {
            models.add(new Kind(k.id(), k.summary(), k.parameters()));
        }
        List<Kind> hidden = new ArrayList<>();
        for (HiddenOption h : HiddenOptions.all()) {
            hidden.add(new Kind(h.id(), h.summary(), h.parameters()));
        }
        List<Kind> missing = new ArrayList<>();
        for (MissingnessMechanism m : MissingnessMechanisms.all()) {
            missing.add(new Kind(m.id(), m.summary(), m.parameters()));
        }
        sections = List.of(
                new Section(GRAPH, "family", null, null, null,
                        "The random graph family the true DAG is drawn from, with its parameters.", families),
                new Section(MODEL, "kind", null, null, null,
                        "The structural-equation model that generates data on the graph, with its parameters.", models),
                new Section(HIDDEN, "kind", HiddenOptions.NONE, HiddenOptions.RANDOM, "count",
                        "Which variables are hidden from the learners (a bare number means that many chosen at random).",
                        hidden),
                new Section(MISSING, "mechanism", MissingnessMechanisms.NONE, null, null,
                        "How cells of the observed data go missing.", missing));
    }

    @Override
    public List<Section> sections() {
        return sections;
    }

    @Override
    public void checkCombination(TruthSetting setting) {
        try {
            simulation(setting).drawTruth(0L);
        } catch (IllegalStateException e) {
            throw new IllegalArgumentException(e.getMessage(), e);
        }
    }

    /** The generators' recipe for a truth setting. */
    public static Simulation simulation(TruthSetting t) {
        TruthSetting.Choice g = t.choice(GRAPH);
        TruthSetting.Choice m = t.choice(MODEL);
        TruthSetting.Choice h = t.choice(HIDDEN);
        TruthSetting.Choice x = t.choice(MISSING);
        Simulation.Builder b = Simulation.builder()
                .graph(GraphFamilies.byId(g.kind()), g.values())
                .model(ModelKinds.byId(m.kind()), m.values());
        if (h != null) {
            b.hidden(HiddenOptions.byId(h.kind()), values(h));
        }
        if (x != null) {
            b.missing(MissingnessMechanisms.byId(x.kind()), values(x));
        }
        return b.build();
    }

    private static ParameterValues values(TruthSetting.Choice c) {
        return c.values();
    }
}

package dev.touchstone.generators.fit;

import dev.touchstone.core.data.DataSet;
import dev.touchstone.core.graph.Graph;
import dev.touchstone.core.random.Seeds;
import dev.touchstone.generators.missing.MissingnessPlan;
import dev.touchstone.generators.models.StructuralModel;

/**
 * A truth to simulate from: a name, what it is, its DAG, its model and its missingness.
 * {@link #sample} is deterministic in the seed and nested in the number of rows (the first
 * n rows of a larger sample are the sample of n rows), as for every model of the
 * generators. Immutable and thread-safe; cost of a sample O(rows · (p + edges)).
 */
public final class FittedTruth {

    private final String name;
    private final String description;
    private final Graph dag;
    private final StructuralModel model;
    private final MissingnessPlan missingness;

    public FittedTruth(String name, String description, Graph dag, StructuralModel model,
                       MissingnessPlan missingness) {
        this.name = name;
        this.description = description;
        this.dag = dag;
        this.model = model;
        this.missingness = missingness;
    }

    /** The short name the caller gave it. */
    public String name() {
        return name;
    }

    /** One line saying how this truth was made. */
    public String description() {
        return description;
    }

    /** The true DAG. */
    public Graph dag() {
        return dag;
    }

    /** The model data are drawn from. */
    public StructuralModel model() {
        return model;
    }

    /** How cells go missing in drawn data. */
    public MissingnessPlan missingness() {
        return missingness;
    }

    /** A data set of {@code rows} rows with missing cells as planned, columns in graph order. */
    public DataSet sample(int rows, long seed) {
        DataSet complete = model.sampleComplete(rows, Seeds.derive(seed, "values"));
        return model.observe(missingness.apply(complete, Seeds.derive(seed, "missing")));
    }
}

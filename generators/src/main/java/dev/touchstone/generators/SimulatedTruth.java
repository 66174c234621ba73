package dev.touchstone.generators;

import dev.touchstone.core.data.CovarianceMatrix;
import dev.touchstone.core.data.DataSet;
import dev.touchstone.core.graph.Graph;
import dev.touchstone.core.knowledge.Knowledge;
import dev.touchstone.generators.missing.MissingnessDriver;
import dev.touchstone.generators.missing.MissingnessPlan;
import dev.touchstone.generators.models.StructuralModel;

import java.util.List;
import java.util.Optional;

/**
 * The truth of one replicate: the DAG (hidden variables flagged), the knowledge its
 * construction implies (over observed variables), the causal order it was built along,
 * the fully specified model and the missingness plan. Immutable and thread-safe.
 *
 * <p>{@link #sample(int)} gives the replicate's data at any sample size; smaller sizes
 * are exact prefixes of larger ones (nested design), so every size shares one draw.
 */
public final class SimulatedTruth {

    private final long seed;
    private final Graph dag;
    private final Knowledge knowledge;
    private final List<String> causalOrder;
    private final StructuralModel model;
    private final MissingnessPlan missingness;
    private final long dataSeed;

    SimulatedTruth(long seed, Graph dag, Knowledge knowledge, List<String> causalOrder, StructuralModel model,
                   MissingnessPlan missingness, long dataSeed) {
        this.seed = seed;
        this.dag = dag;
        this.knowledge = knowledge;
        this.causalOrder = List.copyOf(causalOrder);
        this.model = model;
        this.missingness = missingness;
        this.dataSeed = dataSeed;
    }

    /** The same truth drawing its data with another seed: nothing of the model is rebuilt. */
    SimulatedTruth withDataSeed(long otherDataSeed) {
        return new SimulatedTruth(seed, dag, knowledge, causalOrder, model, missingness, otherDataSeed);
    }

    /** The replicate seed this truth was drawn from. */
    public long seed() {
        return seed;
    }

    /** The generating DAG over all variables, hidden ones flagged. */
    public Graph dag() {
        return dag;
    }

    /** Knowledge implied by the graph family (tiers of a layered graph), over observed variables. */
    public Knowledge knowledge() {
        return knowledge;
    }

    /** The variable names in the causal order the DAG was built along. */
    public List<String> causalOrder() {
        return causalOrder;
    }

    public StructuralModel model() {
        return model;
    }

    public MissingnessPlan missingness() {
        return missingness;
    }

    /** Which variable drives whose missingness (empty when nothing is missing). */
    public List<MissingnessDriver> missingnessDrivers() {
        return missingness.drivers();
    }

    /** The exact covariance of the observed variables (data column order), where the model defines one. */
    public Optional<CovarianceMatrix> populationCovariance() {
        return model.populationCovariance();
    }

    /** Every parameter of this truth as plain values; {@link TruthParameters#truth()} rebuilds it. */
    public TruthParameters parameters() {
        return new TruthParameters(seed, dataSeed, model.parameters(), missingness.drivers(), knowledge.tiers());
    }

    /** The seed the data are drawn with (derived from the replicate seed). */
    public long dataSeed() {
        return dataSeed;
    }

    /**
     * The replicate's data with {@code rows} rows: observed columns in the model's column
     * order, with missing cells as planned.
     */
    public SimulatedReplicate sample(int rows) {
        DataSet complete = model.sampleComplete(rows, dataSeed);
        DataSet masked = missingness.apply(complete, dataSeed);
        return new SimulatedReplicate(this, model.observe(masked));
    }

    /** Every variable, hidden ones included, with no cells masked (for checks and audits). */
    public DataSet completeSample(int rows) {
        return model.sampleComplete(rows, dataSeed);
    }
}

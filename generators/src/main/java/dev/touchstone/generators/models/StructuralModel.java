package dev.touchstone.generators.models;

import dev.touchstone.core.data.CovarianceMatrix;
import dev.touchstone.core.data.DataKind;
import dev.touchstone.core.data.DataSet;
import dev.touchstone.core.graph.Graph;

import java.util.List;
import java.util.Optional;
import java.util.Set;

/**
 * One fully specified structural-equation model over a DAG: every weight, function, table
 * and scale is fixed. Immutable and thread-safe.
 *
 * <p>Sampling is deterministic in the seed, and each variable draws from its own random
 * stream derived from the seed and the variable's name ({@code Seeds.derive(seed,
 * "variable", name)}), consuming a fixed number of draws per row. Hence {@code
 * sample(n, s)} is exactly the first n rows of {@code sample(N, s)} for n ≤ N (nested
 * sample sizes), and a variable's noise does not depend on the other variables.
 */
public interface StructuralModel {

    /** The true DAG, hidden variables flagged. */
    Graph graph();

    /** The id of the kind that drew this model (or of the reference network). */
    String kindId();

    /** The kind of data produced (over the observed variables). */
    DataKind dataKind();

    /** The observed variable names in data column order (shuffled when the model was drawn so). */
    List<String> columnOrder();

    /**
     * Every variable, hidden ones included, in graph index order, after standardisation if
     * it was asked for, before column shuffling. Missing-value mechanisms read this.
     */
    DataSet sampleComplete(int rows, long seed);

    /** The observed columns of a complete sample, in {@link #columnOrder()}. */
    DataSet observe(DataSet complete);

    /** The observed data: {@code observe(sampleComplete(rows, seed))}. */
    default DataSet sample(int rows, long seed) {
        return observe(sampleComplete(rows, seed));
    }

    /**
     * The exact covariance of the observed variables in {@link #columnOrder()} (after
     * standardisation if asked for), where the model defines one in closed form (linear
     * models: (I − B)⁻¹ Ω (I − B)⁻ᵀ); empty otherwise.
     */
    Optional<CovarianceMatrix> populationCovariance();

    /** Every parameter of the model as plain values; {@link ModelParameters#model()} rebuilds it exactly. */
    ModelParameters parameters();

    /** The same model with these variables hidden and all others observed. */
    StructuralModel withHidden(Set<String> hidden);
}

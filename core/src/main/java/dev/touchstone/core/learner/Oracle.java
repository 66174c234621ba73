package dev.touchstone.core.learner;

import dev.touchstone.core.data.CovarianceMatrix;
import dev.touchstone.core.graph.Graph;
import dev.touchstone.core.graph.algorithms.DSeparation;

import java.util.List;
import java.util.Objects;

/**
 * The infinite-sample stand-in for data: answers independence questions by d-separation
 * in the true DAG (so, when some variables are hidden, by m-separation in its latent
 * projection) and, when the model provides it, gives the exact population covariance.
 *
 * <p>Variables are addressed by their position in {@link #variableNames()}, the observed
 * variables of the truth in graph order.
 */
public final class Oracle {

    private final Graph trueDag;
    private final int[] observed;
    private final List<String> names;
    private final CovarianceMatrix populationCovariance;
    private final DSeparation dsep;

    /**
     * @param trueDag              the generating DAG, hidden variables flagged
     * @param populationCovariance the exact covariance over the observed variables, in their order, or null
     */
    public Oracle(Graph trueDag, CovarianceMatrix populationCovariance) {
        this.trueDag = Objects.requireNonNull(trueDag, "trueDag");
        this.observed = trueDag.observedIndices();
        String[] n = new String[observed.length];
        for (int i = 0; i < observed.length; i++) {
            n[i] = trueDag.name(observed[i]);
        }
        this.names = List.of(n);
        if (populationCovariance != null && !populationCovariance.names().equals(names)) {
            throw new IllegalArgumentException("the population covariance must be over the observed variables "
                    + names + ", got " + populationCovariance.names());
        }
        this.populationCovariance = populationCovariance;
        this.dsep = new DSeparation(trueDag);
    }

    /** The true DAG, hidden variables flagged. */
    public Graph trueDag() {
        return trueDag;
    }

    /** The observed variables, in graph order. */
    public List<String> variableNames() {
        return names;
    }

    /** The exact covariance over the observed variables, or null when the model has none. */
    public CovarianceMatrix populationCovariance() {
        return populationCovariance;
    }

    /**
     * Whether observed variables {@code x} and {@code y} are d-separated given the observed
     * variables {@code given} (positions in {@link #variableNames()}). Thread-safe.
     */
    public boolean independent(int x, int y, int[] given) {
        int[] z = new int[given.length];
        for (int i = 0; i < given.length; i++) {
            z[i] = observed[given[i]];
        }
        return dsep.separated(observed[x], observed[y], z);
    }
}

package dev.touchstone.harness.execution;

import dev.touchstone.core.data.CovarianceMatrix;
import dev.touchstone.core.data.DataSet;
import dev.touchstone.core.graph.Graph;
import dev.touchstone.core.knowledge.Knowledge;
import dev.touchstone.core.learner.LearnerInput;
import dev.touchstone.core.learner.Oracle;
import dev.touchstone.harness.study.KnowledgeSource;
import dev.touchstone.harness.study.SampleSize;

import java.util.Objects;
import java.util.function.Supplier;

/**
 * One replicate's draw, shared by all its runs: the true DAG (hidden variables flagged),
 * one data set of the largest sample size over the observed variables (smaller sample sizes
 * are its prefixes, so they are nested) and, when the model has one, the exact population
 * covariance of the observed variables, which may be given as a supplier called on first
 * use (it is p × p, so a simulation that never asks for it should not pay for it). Immutable.
 */
public final class Replicate {

    private final Graph trueDag;
    private final DataSet data;
    private final Supplier<CovarianceMatrix> covarianceSupplier;
    private volatile CovarianceMatrix populationCovariance;
    private volatile boolean covarianceKnown;
    private final Knowledge tiers;
    private volatile Oracle oracle;

    /**
     * @param trueDag              the generating DAG
     * @param data                 the data over the observed variables, or null when the study has only the oracle
     * @param populationCovariance the exact covariance over the observed variables, or null
     */
    public Replicate(Graph trueDag, DataSet data, CovarianceMatrix populationCovariance) {
        this(trueDag, data, populationCovariance, Knowledge.none());
    }

    /**
     * @param tiers the truth's tiers over the observed variables (e.g. a layered graph's layers), or none
     */
    public Replicate(Graph trueDag, DataSet data, CovarianceMatrix populationCovariance, Knowledge tiers) {
        this.trueDag = Objects.requireNonNull(trueDag, "trueDag");
        this.data = data;
        this.covarianceSupplier = null;
        this.populationCovariance = populationCovariance;
        this.covarianceKnown = true;
        this.tiers = Objects.requireNonNull(tiers, "tiers");
    }

    /**
     * A replicate whose population covariance is computed on first use.
     *
     * @param populationCovariance gives the exact covariance over the observed variables, or null
     */
    public static Replicate withLazyCovariance(Graph trueDag, DataSet data,
            Supplier<CovarianceMatrix> populationCovariance, Knowledge tiers) {
        return new Replicate(trueDag, data, Objects.requireNonNull(populationCovariance, "populationCovariance"), tiers, true);
    }

    private Replicate(Graph trueDag, DataSet data, Supplier<CovarianceMatrix> supplier, Knowledge tiers, boolean lazy) {
        this.trueDag = Objects.requireNonNull(trueDag, "trueDag");
        this.data = data;
        this.covarianceSupplier = supplier;
        this.tiers = Objects.requireNonNull(tiers, "tiers");
    }

    /** The knowledge a run of this configuration receives: the truth's tiers, or none. */
    public Knowledge knowledge(KnowledgeSource source) {
        return source == KnowledgeSource.TIERS ? tiers : Knowledge.none();
    }

    public Graph trueDag() {
        return trueDag;
    }

    /** The full draw, or null. */
    public DataSet data() {
        return data;
    }

    /** The exact covariance over the observed variables, or null when the model has none. */
    public CovarianceMatrix populationCovariance() {
        if (!covarianceKnown) {
            synchronized (this) {
                if (!covarianceKnown) {
                    populationCovariance = covarianceSupplier.get();
                    covarianceKnown = true;
                }
            }
        }
        return populationCovariance;
    }

    /** What a learner sees at this sample size: the first {@code n} rows, or the oracle. */
    public LearnerInput input(SampleSize n) {
        if (n.isOracle()) {
            return LearnerInput.of(oracle());
        }
        if (data == null || data.rows() < n.intRows()) {
            throw new IllegalStateException("the replicate's draw has " + (data == null ? 0 : data.rows())
                    + " rows, fewer than the sample size " + n.word());
        }
        return LearnerInput.of(data.rows() == n.intRows() ? data : data.head(n.intRows()));
    }

    /** The oracle over this truth (built once). */
    public Oracle oracle() {
        Oracle o = oracle;
        if (o == null) {
            synchronized (this) {
                if (oracle == null) {
                    oracle = new Oracle(trueDag, populationCovariance);
                }
                o = oracle;
            }
        }
        return o;
    }
}

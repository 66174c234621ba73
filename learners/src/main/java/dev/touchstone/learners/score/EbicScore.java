package dev.touchstone.learners.score;

import java.util.List;

/**
 * The extended BIC of a linear Gaussian DAG as a local score: the {@link BicScore} of the
 * node given its parents, minus a prior term for having chosen those parents among the
 * p − 1 other variables. On the −2·log-likelihood scale, for a node Y with k parents,
 *
 * <pre>
 *   EBIC_γ(Y | P) = −2 · loglik + c · (k + 2) · ln n + 2γ · k · ln(p − 1)
 * </pre>
 *
 * and this class returns −EBIC/2 (higher is better, on the scale of {@link BicScore}):
 * {@code bic.localScore(Y, P) − γ · k · ln(p − 1)}, with γ ∈ [0, 1]; γ = 0 is the BIC.
 *
 * <p><b>Which form, and why.</b> Chen and Chen (2008, Biometrika 95) penalise a
 * regression that picks k of P candidate covariates by 2γ · ln C(P, k); Foygel and Drton
 * (2010, NeurIPS) use for a Gaussian graphical model with edge set E the linear form
 * 4γ · |E| · ln p (both forms from memory), which is what one gets by charging each undirected edge 2γ · ln p in each
 * of the two regressions it appears in. This class uses that linear form per directed edge,
 * 2γ · k · ln(p − 1) for a node choosing k of the p − 1 other variables, rather than the
 * binomial one, because (a) every added parent then costs the same, 2γ · ln(p − 1), so an
 * edge's value does not depend on how many parents its head already has, whereas the
 * binomial form's marginal cost ln((p − 1 − k)/(k + 1)) falls with k and turns negative once
 * k &gt; (p − 2)/2, rewarding large parent sets on small graphs; and (b) since
 * C(p − 1, k) ≤ (p − 1)^k the linear form is never weaker, so the false-edge side of
 * Chen and Chen's consistency argument holds a fortiori (our reasoning). For sparse graphs
 * (k small) the two differ by about ln k! per node, about ln 2 for two parents.
 *
 * <p><b>Properties.</b> The extra term depends only on k (and the fixed p), so the score stays
 * decomposable and score-equivalent: a covered-edge reversal keeps the multiset of parent-set
 * sizes (Chickering 1995), and so the sum of the terms. With the exact population covariance
 * the BIC part is evaluated at {@link BicScore#ORACLE_SAMPLE_SIZE} rows and the extra term
 * is at most γ · ln(p − 1) per edge (3.5 at p = 1,000, γ = 0.5) next to the BIC's
 * c · ln(10⁹)/2 ≈ 10.4 c, so the oracle reasoning of {@link BicScore} carries over with the
 * floor on a detectable r² moved from about 2·10⁻⁸ to about 3·10⁻⁸.
 *
 * <p><b>Cost.</b> That of the BIC term plus one multiply-add. Thread-safe and immutable.
 */
public final class EbicScore implements LocalScore {

    private final BicScore bic;
    private final double gamma;
    private final double perParent;

    private EbicScore(BicScore bic, double gamma) {
        if (!(gamma >= 0 && gamma <= 1)) {
            throw new IllegalArgumentException("the extended BIC's gamma must be in [0, 1], got " + gamma);
        }
        this.bic = bic;
        this.gamma = gamma;
        // a single variable has no candidate parents; ln(1) = 0 keeps the term defined
        this.perParent = gamma * Math.log(Math.max(bic.variableCount() - 1, 1));
    }

    /**
     * The extended BIC with parameter {@code gamma} over a BIC (whose penalty multiplier and
     * sample or population covariance it keeps).
     *
     * @throws IllegalArgumentException for gamma outside [0, 1]
     */
    public static EbicScore of(BicScore bic, double gamma) {
        return new EbicScore(bic, gamma);
    }

    @Override
    public List<String> names() {
        return bic.names();
    }

    @Override
    public double localScore(int node, int[] parents) {
        return bic.localScore(node, parents) - perParent * parents.length;
    }

    @Override
    public void scoreAdditions(int node, int[] parents, boolean[] candidates, double[] out) {
        bic.scoreAdditions(node, parents, candidates, out);
        double extra = perParent * (parents.length + 1);
        for (int x = 0; x < candidates.length; x++) {
            if (candidates[x]) {
                out[x] -= extra;
            }
        }
    }

    /** As the BIC it extends: the extra term adds nothing worth a memo. */
    @Override
    public boolean worthCaching(int parentCount) {
        return bic.worthCaching(parentCount);
    }

    @Override
    public String describe() {
        return "ebic(gamma=" + gamma + ", " + bic.describe() + ")";
    }
}

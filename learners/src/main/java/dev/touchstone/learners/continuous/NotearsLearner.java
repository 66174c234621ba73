package dev.touchstone.learners.continuous;

import dev.touchstone.core.data.CovarianceMatrix;
import dev.touchstone.core.data.DataKind;
import dev.touchstone.core.graph.Graph;
import dev.touchstone.core.graph.GraphClass;
import dev.touchstone.core.graph.MutableGraph;
import dev.touchstone.core.learner.DeclaredLearner;
import dev.touchstone.core.learner.Estimate;
import dev.touchstone.core.learner.KnowledgeUse;
import dev.touchstone.core.learner.LearnerDescription;
import dev.touchstone.core.learner.LearnerFamily;
import dev.touchstone.core.learner.LearnerInput;
import dev.touchstone.core.learner.LearnerRun;
import dev.touchstone.core.learner.MissingValues;
import dev.touchstone.core.learner.OracleUse;
import dev.touchstone.core.learner.RunContext;
import dev.touchstone.core.param.Parameter;
import dev.touchstone.core.param.ParameterValues;
import dev.touchstone.learners.knowledge.KnowledgeIndex;

import java.util.List;
import java.util.Map;

/**
 * Linear NOTEARS (Zheng et al. 2018, "DAGs with NO TEARS: continuous optimization for
 * structure learning", NeurIPS): minimises the least-squares loss
 * ½ tr((I − W)ᵀ S (I − W)) (= 1/(2n) ‖X − XW‖² with S the covariance) plus λ‖W‖₁ subject to
 * h(W) = tr(e^{W∘W}) − d = 0 ({@link Acyclicity}), by the augmented Lagrangian of the paper
 * (penalty ρ multiplied by 10 until h falls to a quarter, then the multiplier update
 * α += ρh, until h ≤ acyclicity_tolerance or ρ reaches its cap), each subproblem solved on the split
 * W = W⁺ − W⁻ with W⁺, W⁻ ≥ 0 by {@link ProjectedLbfgs} (our stand-in for L-BFGS-B).
 * Entries with |w| below the weight threshold are then dropped; if cycles remain, the
 * weakest edges on cycles are dropped too ({@link CycleBreaker}) and counted in the
 * estimate's extra {@code edges_dropped_on_cycles}.
 *
 * <p>Forbidden edges and tiers are honoured by holding the corresponding weights at 0.
 *
 * <p>Cost: independent of n once the covariance exists; each function evaluation costs
 * O(d³ log‖W∘W‖) for the matrix exponential and products, times the (problem-dependent)
 * number of L-BFGS iterations, typically hundreds to a few thousand in all.
 */
public final class NotearsLearner extends DeclaredLearner {

    public static final String ID = "notears-linear";

    static final Parameter<Double> L1_WEIGHT = Parameter.real("l1_weight", 0.1, 0.0, Double.POSITIVE_INFINITY,
            "weight λ of the L1 penalty on W");
    static final Parameter<Double> WEIGHT_THRESHOLD = Parameter.real("weight_threshold", 0.3, 0.0,
            Double.POSITIVE_INFINITY, "edges with |w| below this are dropped after optimisation (0.3 in the paper)");
    static final Parameter<Integer> MAX_OUTER = Parameter.integer("max_outer_iterations", 100, 1, 10_000,
            "most dual (multiplier) updates of the augmented Lagrangian");
    static final Parameter<Integer> MAX_INNER = Parameter.integer("max_inner_iterations", 2_000, 1, 1_000_000,
            "most quasi-Newton iterations per subproblem");
    static final Parameter<Double> H_TOLERANCE = Parameter.real("acyclicity_tolerance", 1e-8, 1e-16, 1.0,
            "stop once the acyclicity function h(W) is at most this");
    static final Parameter<Double> RHO_MAX = Parameter.real("penalty_limit", 1e16, 1.0, 1e20,
            "stop once the augmented Lagrangian's penalty weight ρ reaches this");

    /** Stopping rule of each subproblem: projected gradient and relative decrease (L-BFGS-B defaults). */
    private static final double GRADIENT_TOLERANCE = 1e-5;
    private static final double RELATIVE_DECREASE = 2.2e-9;
    private static final int MEMORY = 10;

    private static final LearnerDescription DESCRIPTION = LearnerDescription.builder(ID)
            .summary("least squares with an L1 penalty under the smooth acyclicity constraint tr(exp(W∘W)) = d,"
                    + " solved by an augmented Lagrangian, then thresholded")
            .publication("Zheng, Aragam, Ravikumar and Xing (2018), DAGs with NO TEARS: continuous optimization"
                    + " for structure learning, NeurIPS")
            .family(LearnerFamily.CONTINUOUS)
            .accepts(DataKind.CONTINUOUS)
            .returns(GraphClass.DAG)
            .missingValues(MissingValues.LIST_WISE)
            .knowledge(KnowledgeUse.FORBIDDEN_EDGES, KnowledgeUse.TIERS)
            .oracle(OracleUse.COVARIANCE)
            .assumption("linear structural equations")
            .assumption("roughly equal noise variances (the least-squares loss favours orders of increasing"
                    + " variance; see Reisach, Seiler and Weichwald 2021)")
            .assumption("acyclicity and no hidden confounding")
            .assumption("a local optimum of a non-convex problem; not guaranteed to be the global one")
            .parameter(L1_WEIGHT)
            .parameter(WEIGHT_THRESHOLD)
            .parameter(MAX_OUTER)
            .parameter(MAX_INNER)
            .parameter(H_TOLERANCE)
            .parameter(RHO_MAX)
            .build();

    public NotearsLearner() {
        super(DESCRIPTION);
    }

    @Override
    protected Estimate run(LearnerRun run) {
        RunContext context = run.context();
        LearnerInput input = run.input();
        CovarianceMatrix cov = input.isOracle() ? input.oracle().populationCovariance() : input.data().covariance();
        List<String> names = run.names();
        int d = names.size();
        KnowledgeIndex knowledge = KnowledgeIndex.of(run.knowledge(), names);
        boolean[] forbidden = new boolean[d * d];
        for (int i = 0; i < d; i++) {
            for (int j = 0; j < d; j++) {
                forbidden[i * d + j] = i == j || knowledge.isForbidden(i, j);
            }
        }
        Fit fit = fit(cov.toArray(), d, forbidden, Settings.of(run.parameters()), context);
        double threshold = run.get(WEIGHT_THRESHOLD);
        double[] w = fit.weights().clone();
        for (int k = 0; k < w.length; k++) {
            if (Math.abs(w[k]) < threshold) {
                w[k] = 0;
            }
        }
        int dropped = CycleBreaker.breakCycles(w, d);
        MutableGraph g = Graph.builder(names);
        for (int i = 0; i < d; i++) {
            for (int j = 0; j < d; j++) {
                if (w[i * d + j] != 0) {
                    g.addDirected(i, j);
                }
            }
        }
        return new Estimate(g.freeze(), GraphClass.DAG, Map.of(
                "acyclicity", fit.acyclicity(),
                "penalty_rho", fit.rho(),
                "function_evaluations", (double) fit.evaluations(),
                "edges_dropped_on_cycles", (double) dropped));
    }

    /** The optimiser's settings, read from declared parameters. */
    record Settings(double l1, int maxOuter, int maxInner, double hTolerance, double rhoMax) {
        static Settings of(ParameterValues v) {
            return new Settings(v.get(L1_WEIGHT), v.get(MAX_OUTER), v.get(MAX_INNER),
                    v.get(H_TOLERANCE), v.get(RHO_MAX));
        }
    }

    /** The unthresholded solution with the final h(W) and ρ. */
    record Fit(double[] weights, double acyclicity, double rho, long evaluations) {
    }

    /**
     * Runs the augmented Lagrangian on covariance {@code s} (row-major d × d), holding the
     * weights flagged in {@code held} (length d², diagonal included) at 0.
     */
    static Fit fit(double[] s, int d, boolean[] held, Settings settings, RunContext context) {
        int dd = d * d;
        double[] x = new double[2 * dd];
        boolean[] heldSplit = new boolean[2 * dd];
        for (int k = 0; k < dd; k++) {
            heldSplit[k] = held[k];
            heldSplit[dd + k] = held[k];
        }
        ProjectedLbfgs solver = new ProjectedLbfgs(MEMORY, settings.maxInner(), GRADIENT_TOLERANCE,
                RELATIVE_DECREASE);
        double rho = 1;
        double alpha = 0;
        double h = Double.POSITIVE_INFINITY;
        double[] w = new double[dd];
        double[] trial = x.clone();
        long evaluations = 0;
        for (int outer = 0; outer < settings.maxOuter(); outer++) {
            double hNew = h;
            while (rho < settings.rhoMax()) {
                context.checkDeadline();
                System.arraycopy(x, 0, trial, 0, x.length);
                Lagrangian objective = new Lagrangian(s, d, settings.l1(), rho, alpha);
                evaluations += solver.minimise(objective, trial, heldSplit, context).evaluations();
                combine(trial, w, dd);
                hNew = Acyclicity.value(w, d);
                if (hNew > 0.25 * h) {
                    rho *= 10;
                } else {
                    break;
                }
            }
            System.arraycopy(trial, 0, x, 0, x.length);
            h = hNew;
            alpha += rho * h;
            if (h <= settings.hTolerance() || rho >= settings.rhoMax()) {
                break;
            }
        }
        combine(x, w, dd);
        return new Fit(w, Acyclicity.value(w, d), rho, evaluations);
    }

    private static void combine(double[] x, double[] w, int dd) {
        for (int k = 0; k < dd; k++) {
            w[k] = x[k] - x[dd + k];
        }
    }

    /**
     * The augmented Lagrangian ½ tr((I−W)ᵀS(I−W)) + (ρ/2) h² + α h + λ Σ(W⁺ + W⁻) on the split
     * variables x = (W⁺, W⁻).
     */
    static final class Lagrangian implements ProjectedLbfgs.Objective {
        private final double[] s;
        private final int d;
        private final double l1;
        private final double rho;
        private final double alpha;
        private final double[] w;
        private final double[] sw;
        private final double[] gradH;

        Lagrangian(double[] s, int d, double l1, double rho, double alpha) {
            this.s = s;
            this.d = d;
            this.l1 = l1;
            this.rho = rho;
            this.alpha = alpha;
            this.w = new double[d * d];
            this.sw = new double[d * d];
            this.gradH = new double[d * d];
        }

        @Override
        public double evaluate(double[] x, double[] gradient) {
            int dd = d * d;
            double penalty = 0;
            for (int k = 0; k < dd; k++) {
                w[k] = x[k] - x[dd + k];
                penalty += x[k] + x[dd + k];
            }
            Acyclicity.multiply(s, w, sw, d);
            double loss = 0;
            for (int i = 0; i < d; i++) {
                for (int j = 0; j < d; j++) {
                    int k = i * d + j;
                    double m = s[k] - sw[k]; // (S(I − W))_ij
                    double iw = (i == j ? 1 : 0) - w[k];
                    loss += iw * m;
                    sw[k] = -m; // now the gradient of the loss
                }
            }
            loss *= 0.5;
            double h = Acyclicity.valueAndGradient(w, d, gradH);
            double factor = rho * h + alpha;
            for (int k = 0; k < dd; k++) {
                double gw = sw[k] + factor * gradH[k];
                gradient[k] = gw + l1;
                gradient[dd + k] = -gw + l1;
            }
            return loss + 0.5 * rho * h * h + alpha * h + l1 * penalty;
        }
    }
}

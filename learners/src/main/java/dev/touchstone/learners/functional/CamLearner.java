package dev.touchstone.learners.functional;

import dev.touchstone.core.data.DataSet;
import dev.touchstone.core.graph.Graph;
import dev.touchstone.core.graph.GraphClass;
import dev.touchstone.core.graph.MutableGraph;
import dev.touchstone.core.learner.DeclaredLearner;
import dev.touchstone.core.learner.Estimate;
import dev.touchstone.core.learner.KnowledgeUse;
import dev.touchstone.core.learner.LearnerDescription;
import dev.touchstone.core.learner.LearnerRun;
import dev.touchstone.core.learner.RunContext;
import dev.touchstone.core.param.Parameter;
import dev.touchstone.learners.knowledge.KnowledgeIndex;

import java.util.ArrayList;
import java.util.List;

/**
 * CAM, causal additive models (Bühlmann, Peters and Ernest 2014, "CAM: Causal additive models,
 * high-dimensional order search and penalized regression", Annals of Statistics 42): for
 * x_k = Σ_{j ∈ pa(k)} f_jk(x_j) + e_k with Gaussian e_k, the DAG maximising the likelihood
 * −(n/2) Σ_k log σ̂²_k is identifiable when the f_jk are nonlinear, and CAM approaches it in
 * three stages.
 *
 * <ol>
 * <li>Preliminary neighbourhood selection: each node keeps {@code candidate_parents}
 *     candidates, those with the largest univariate additive-fit gain ({@link CamOrderSearch}).</li>
 * <li>Greedy search: the candidate edge with the largest likelihood gain that closes no cycle is
 *     added while the gain is positive ({@link CamOrderSearch}).</li>
 * <li>Pruning: parents whose smooth term fails an F-test at {@code pruning_level} are removed
 *     ({@link CamPruning}).</li>
 * </ol>
 *
 * <p>Every additive fit is backfitted P-splines ({@link AdditiveRegression},
 * {@link PSplineSmoother}: cubic B-splines on {@code spline_segments} equal intervals,
 * second-difference penalty chosen by GCV). Forbidden edges and tiers remove edges from the
 * search; required edges are placed first and never pruned. Every additive fit is counted as
 * a score evaluation.
 */
public final class CamLearner extends DeclaredLearner {

    public static final String ID = "cam";

    static final Parameter<Integer> CANDIDATES = Parameter.integer("candidate_parents", 10, 1, 10_000,
            "candidate parents kept per variable before the search: those with the largest univariate additive-fit gain");
    static final Parameter<Double> PRUNING_LEVEL = Parameter.real("pruning_level", 0.001, 1e-12, 1.0,
            "a parent is kept when the F-test of its smooth term has a p-value below this level");
    static final Parameter<Integer> SEGMENTS = Parameter.integer("spline_segments", 10, 1, 200,
            "equal knot intervals of each cubic P-spline (segments + 3 basis functions)");

    /** Fewer rows than this leave GCV no residual degrees of freedom with the default basis. */
    private static final int MIN_ROWS = 10;

    private static final LearnerDescription DESCRIPTION = FunctionalLearners.describe(ID,
                    "keeps a few candidate parents per variable, greedily adds the edge that most raises the Gaussian"
                            + " likelihood of additive spline fits, then drops parents whose smooth term fails an F-test",
                    "Bühlmann, Peters and Ernest (2014), CAM: Causal additive models, high-dimensional order search"
                            + " and penalized regression, Annals of Statistics 42; P-splines of Eilers and Marx (1996)")
            .knowledge(KnowledgeUse.REQUIRED_EDGES, KnowledgeUse.FORBIDDEN_EDGES, KnowledgeUse.TIERS)
            .assumption("additive model: each variable is a sum of smooth functions of single parents plus noise")
            .assumption("Gaussian noise (the likelihood); nonlinear functions make the DAG identifiable")
            .assumption(FunctionalLearners.ACYCLIC)
            .parameter(CANDIDATES)
            .parameter(PRUNING_LEVEL)
            .parameter(SEGMENTS)
            .build();

    public CamLearner() {
        super(DESCRIPTION);
    }

    @Override
    protected Estimate run(LearnerRun run) {
        RunContext context = run.context();
        DataSet data = data(run, MIN_ROWS);
        List<String> names = run.names();
        int p = data.columns();
        int segments = run.get(SEGMENTS);
        double[][] x = new double[p][];
        List<PSplineSmoother> smoothers = new ArrayList<>(p);
        for (int j = 0; j < p; j++) {
            context.checkDeadline();
            x[j] = data.continuous(j);
            smoothers.add(PSplineSmoother.of(x[j], segments));
        }
        KnowledgeIndex rules = KnowledgeIndex.of(run.knowledge(), names);
        List<List<Integer>> parents = CamOrderSearch.search(x, smoothers, rules,
                run.get(CANDIDATES), context);
        List<List<Integer>> pruned = CamPruning.prune(x, smoothers, parents, rules,
                run.get(PRUNING_LEVEL), context);
        MutableGraph g = Graph.builder(names);
        for (int k = 0; k < p; k++) {
            for (int j : pruned.get(k)) {
                g.addDirected(j, k);
            }
        }
        return Estimate.of(g.freeze(), GraphClass.DAG);
    }
}

package dev.touchstone.learners.functional;

import dev.touchstone.core.data.DataSet;
import dev.touchstone.core.graph.Graph;
import dev.touchstone.core.graph.GraphClass;
import dev.touchstone.core.graph.MutableGraph;
import dev.touchstone.core.learner.DeclaredLearner;
import dev.touchstone.core.learner.Estimate;
import dev.touchstone.core.learner.LearnerDescription;
import dev.touchstone.core.learner.LearnerRun;
import dev.touchstone.core.learner.RunContext;
import dev.touchstone.core.param.Parameter;
import dev.touchstone.core.random.Shuffles;
import dev.touchstone.learners.independence.Hsic;


import java.util.ArrayList;
import java.util.Arrays;
import java.util.List;

/**
 * RESIT, regression with subsequent independence test (Peters, Mooij, Janzing and Schölkopf
 * 2014, "Causal discovery with continuous additive noise models", JMLR 15, Algorithm 1), for
 * additive noise models x_k = f_k(pa_k) + e_k with nonlinear f_k.
 *
 * <p><b>Order.</b> Among the remaining variables S, each x_k is regressed on S \ {x_k}; the
 * one whose residual is least dependent on S \ {x_k} is taken as the sink of S (the highest
 * HSIC p-value; ties, as when p-values underflow to 0, go to the smaller statistic n·HSIC_b,
 * then to the smaller column), put last, and removed; this repeats until one variable is
 * left, which is first.
 *
 * <p><b>Pruning.</b> For the k-th variable of the order, starting from all its predecessors
 * as parents, each predecessor in turn (in the order) is dropped when the residual of the
 * regression of x_k on the remaining parents is independent of all predecessors by HSIC at
 * level {@code alpha} (p &gt; α).
 *
 * <p><b>Declared choices.</b> Regressions are kernel ridge regressions with a Gaussian
 * kernel, low rank and the ridge chosen by generalised cross-validation
 * ({@link KernelRidgeRegression}); dependence is HSIC with the gamma approximation
 * ({@link Hsic}, Gretton et al. 2008). Both cost O(n²) memory and time at least, so at most
 * {@code max_rows} rows are used: a random subset drawn from the run's seed when there are more.
 * Cost: O(p²) regressions and HSIC tests for the order, O(p²) for the pruning.
 */
public final class ResitLearner extends DeclaredLearner {

    public static final String ID = "resit";

    static final Parameter<Double> ALPHA = Parameter.real("alpha", 0.05, 1e-12, 0.999,
            "significance level of the HSIC tests that prune the parents once the order is known");
    static final Parameter<Integer> MAX_ROWS = Parameter.integer("max_rows", 1000, 10, 100_000,
            "with more rows, a random subset of this many (drawn from the run's seed) is used: HSIC costs O(n²)");
    static final Parameter<Integer> RANK = Parameter.integer("regression_rank", 100, 1, 10_000,
            "largest rank of the low-rank kernel of each kernel ridge regression");

    private static final LearnerDescription DESCRIPTION = FunctionalLearners.describe(ID,
                    "orders the variables by regressing each on the others and taking as sink the one whose residual"
                            + " is most independent (HSIC), then prunes each variable's parents by HSIC tests",
                    "Peters, Mooij, Janzing and Schölkopf (2014), Causal discovery with continuous additive noise"
                            + " models, JMLR 15; HSIC with gamma null of Gretton et al. (2008), NIPS")
            .assumption("additive noise: each variable is a (nonlinear) function of its parents plus independent noise")
            .assumption("the model is not one of the non-identifiable cases (e.g. linear with Gaussian noise)")
            .assumption(FunctionalLearners.ACYCLIC)
            .parameter(ALPHA)
            .parameter(MAX_ROWS)
            .parameter(RANK)
            .build();

    public ResitLearner() {
        super(DESCRIPTION);
    }

    @Override
    protected Estimate run(LearnerRun run) {
        RunContext context = run.context();
        DataSet data = data(run, 6);
        double alpha = run.get(ALPHA);
        int rank = run.get(RANK);
        double[][] x = columns(data, run.get(MAX_ROWS), context);
        int[] order = causalOrder(x, rank, context);
        int p = x.length;
        MutableGraph g = Graph.builder(run.names());
        for (int k = 1; k < p; k++) {
            int target = order[k];
            // Every pruning test of this target is against the same predecessors: their
            // centred Gram matrix (O(n²) time and memory) is built once, not once per test.
            Hsic.Sample predecessors = Hsic.sample(select(x, Arrays.copyOf(order, k)));
            List<Integer> parents = new ArrayList<>();
            for (int a = 0; a < k; a++) {
                parents.add(order[a]);
            }
            for (int a = 0; a < k; a++) {
                context.checkDeadline();
                Integer candidate = order[a];
                List<Integer> rest = new ArrayList<>(parents);
                rest.remove(candidate);
                double[] residual = KernelRidgeRegression.residuals(select(x, rest.stream().mapToInt(i -> i).toArray()),
                        x[target], rank);
                context.countTests(1);
                if (Hsic.test(Hsic.sample(new double[][] {residual}), predecessors).pValue() > alpha) {
                    parents = rest;
                }
            }
            for (int parent : parents) {
                g.addDirected(parent, target);
            }
        }
        return Estimate.of(g.freeze(), GraphClass.DAG);
    }

    /** The causal order (first = source) by repeatedly finding the sink, as in the class comment. */
    static int[] causalOrder(double[][] x, int rank, RunContext context) {
        int p = x.length;
        List<Integer> remaining = new ArrayList<>();
        for (int j = 0; j < p; j++) {
            remaining.add(j);
        }
        int[] order = new int[p];
        for (int position = p - 1; position > 0; position--) {
            int best = -1;
            double bestP = -1;
            double bestStat = Double.POSITIVE_INFINITY;
            for (int k : remaining) {
                context.checkDeadline();
                int[] others = remaining.stream().mapToInt(i -> i).filter(i -> i != k).toArray();
                double[][] rest = select(x, others);
                double[] residual = KernelRidgeRegression.residuals(rest, x[k], rank);
                context.countTests(1);
                Hsic.Result r = Hsic.test(new double[][] {residual}, rest);
                if (r.pValue() > bestP || (r.pValue() == bestP && r.statistic() < bestStat)) {
                    best = k;
                    bestP = r.pValue();
                    bestStat = r.statistic();
                }
            }
            order[position] = best;
            remaining.remove(Integer.valueOf(best));
        }
        order[0] = remaining.get(0);
        return order;
    }

    private static double[][] select(double[][] x, int[] vars) {
        double[][] out = new double[vars.length][];
        for (int k = 0; k < vars.length; k++) {
            out[k] = x[vars[k]];
        }
        return out;
    }

    /** The columns, restricted to a seeded random subset of {@code maxRows} rows when there are more. */
    private static double[][] columns(DataSet data, int maxRows, RunContext context) {
        int n = data.rows();
        int[] rows = Shuffles.identity(n);
        if (n > maxRows) {
            rows = Arrays.copyOf(Shuffles.shuffleHead(context.random("resit-rows"), rows, maxRows), maxRows);
            Arrays.sort(rows);
        }
        double[][] x = new double[data.columns()][rows.length];
        for (int j = 0; j < x.length; j++) {
            double[] col = data.continuous(j);
            for (int i = 0; i < rows.length; i++) {
                x[j][i] = col[rows[i]];
            }
        }
        return x;
    }
}

package dev.touchstone.generators.fit;

import dev.touchstone.core.data.DataSet;
import dev.touchstone.core.graph.Graph;
import dev.touchstone.core.graph.MutableGraph;
import dev.touchstone.core.graph.algorithms.Ancestry;
import dev.touchstone.core.random.Seeds;
import org.apache.commons.rng.UniformRandomProvider;

import java.util.ArrayList;
import java.util.Arrays;
import java.util.List;
import java.util.Locale;

/**
 * A plausible variant of a fitted truth, so that a calibration does not hinge on one guess
 * of the graph and its effect sizes (a sensitivity analysis in the sense of common
 * practice; our own recipe):
 *
 * <ol>
 * <li>each edge of the fitted DAG is dropped with probability {@code dropFraction};</li>
 * <li>the edge count is moved to the fitted count times a density factor drawn uniformly
 *     from [{@code densityLow}, {@code densityHigh}], removing random edges or adding
 *     random ones that point forward in the fitted DAG's topological order (so the
 *     variant stays acyclic and keeps the fitted order);</li>
 * <li>all parameters are re-fitted to the data over the new DAG (so a kept edge keeps
 *     an effect the data support);</li>
 * <li>each edge's effect (weights and shifts of a continuous child, slopes of a discrete
 *     child; for the discrete parents of a discrete child, the spread of its table's
 *     log-odds across configurations) is multiplied by exp(u), u uniform on ±ln
 *     {@code effectFactor}; an added edge into a continuous child whose standardised
 *     effect is below the median standardised effect of the fitted model is raised to
 *     that median, so added edges are not invisible.</li>
 * </ol>
 *
 * All draws come from the seed given. Cost: one re-fit ({@link StructureFit}) plus
 * O(p²) for the edge changes.
 */
public record Perturbation(double dropFraction, double densityLow, double densityHigh, double effectFactor) {

    /** Discrete children get no added discrete parent beyond this many parent configurations. */
    static final int MAX_ADDED_CONFIGURATIONS = 64;

    public Perturbation {
        if (!(dropFraction >= 0 && dropFraction <= 1) || !(densityLow > 0 && densityLow <= densityHigh)
                || !(effectFactor >= 1)) {
            throw new IllegalArgumentException("perturbation needs 0 ≤ drop ≤ 1, 0 < density low ≤ high and effect"
                    + " factor ≥ 1");
        }
    }

    /** Drop 20% of edges, density factor in [0.7, 1.3], effects scaled by up to ×/÷ 2. */
    public static Perturbation defaults() {
        return new Perturbation(0.2, 0.7, 1.3, 2.0);
    }

    /** The variant of {@code fitted} for this seed, re-fitted to {@code data}. */
    public FittedTruth apply(FittedModel fitted, DataSet data, String name, long seed) {
        UniformRandomProvider rng = Seeds.random(seed);
        Graph dag = fitted.dag();
        int p = dag.size();
        int[] order = Ancestry.topologicalOrder(dag);
        int[] position = new int[p];
        for (int i = 0; i < p; i++) {
            position[order[i]] = i;
        }
        MutableGraph g = Graph.builder(dag.names());
        int original = 0;
        for (var e : dag.edges()) {
            original++;
            if (rng.nextDouble() >= dropFraction) {
                int from = e.tail();
                g.addDirected(from, e.other(from));
            }
        }
        double density = densityLow + (densityHigh - densityLow) * rng.nextDouble();
        int target = Math.min((int) Math.round(original * density), p * (p - 1) / 2);
        while (g.edgeCount() > target) {
            List<int[]> edges = directedEdges(g);
            int[] e = edges.get(rng.nextInt(edges.size()));
            g.removeEdge(e[0], e[1]);
        }
        int attempts = 0;
        while (g.edgeCount() < target && attempts++ < 100 * p * p) {
            int a = rng.nextInt(p);
            int b = rng.nextInt(p);
            if (a == b || g.adjacent(a, b)) {
                continue;
            }
            int from = position[a] < position[b] ? a : b;
            int to = from == a ? b : a;
            if (data.isDiscrete(to) && data.isDiscrete(from) && configurations(g, data, to) * data.variable(from)
                    .cardinality() > MAX_ADDED_CONFIGURATIONS) {
                continue;
            }
            g.addDirected(from, to);
        }
        Graph variant = g.freeze();
        FittedModel refit = StructureFit.fit(variant, data);
        List<FittedNode> scaled = new ArrayList<>();
        double median = medianStandardisedEffect(fitted, data);
        for (FittedNode n : refit.nodes()) {
            scaled.add(scale(n, dag, data, median, rng));
        }
        int added = 0;
        int kept = 0;
        for (var e : variant.edges()) {
            int from = e.tail();
            if (dag.hasDirected(from, e.other(from))) {
                kept++;
            } else {
                added++;
            }
        }
        String description = String.format(Locale.ROOT, "%d of %d fitted edges kept, %d added; effects scaled"
                + " by factors in [%.2f, %.2f]", kept, original, added, 1 / effectFactor, effectFactor);
        return refit.withNodes(scaled).truth(name, description);
    }

    private static int configurations(MutableGraph g, DataSet data, int v) {
        int n = 1;
        for (int q : g.parents(v)) {
            if (data.isDiscrete(q)) {
                n *= data.variable(q).cardinality();
            }
        }
        return n;
    }

    private static List<int[]> directedEdges(MutableGraph g) {
        List<int[]> out = new ArrayList<>();
        for (int v = 0; v < g.size(); v++) {
            for (int c : g.children(v)) {
                out.add(new int[] {v, c});
            }
        }
        return out;
    }

    private double factor(UniformRandomProvider rng) {
        double l = Math.log(effectFactor);
        return Math.exp(-l + 2 * l * rng.nextDouble());
    }

    private FittedNode scale(FittedNode n, Graph original, DataSet data, double median, UniformRandomProvider rng) {
        int child = original.index(n.name());
        if (n instanceof FittedNode.Gaussian g) {
            double sdChild = sd(data, child);
            double[] w = g.weights().clone();
            for (int k = 0; k < w.length; k++) {
                int parent = original.index(g.continuousParents().get(k));
                w[k] *= factor(rng);
                double sdParent = sd(data, parent);
                double standardised = Math.abs(w[k]) * sdParent / sdChild;
                if (!original.hasDirected(parent, child) && standardised < median && sdParent > 0) {
                    double sign = w[k] != 0 ? Math.signum(w[k]) : (rng.nextBoolean() ? 1 : -1);
                    w[k] = sign * median * sdChild / sdParent;
                }
            }
            double[][] s = new double[g.shifts().length][];
            for (int k = 0; k < s.length; k++) {
                int parent = original.index(g.discreteParents().get(k));
                double f = factor(rng);
                s[k] = g.shifts()[k].clone();
                double max = 0;
                for (int c = 0; c < s[k].length; c++) {
                    s[k][c] *= f;
                    max = Math.max(max, Math.abs(s[k][c]));
                }
                if (!original.hasDirected(parent, child) && max < median * sdChild && s[k].length > 1) {
                    if (max == 0) {
                        s[k][1] = (rng.nextBoolean() ? 1 : -1) * median * sdChild;
                    } else {
                        double up = median * sdChild / max;
                        for (int c = 0; c < s[k].length; c++) {
                            s[k][c] *= up;
                        }
                    }
                }
            }
            return new FittedNode.Gaussian(g.name(), g.rows(), g.mean().with(w, s), g.noiseSd(), g.onRows());
        }
        FittedNode.Categorical c = (FittedNode.Categorical) n;
        double[][] slopes = new double[c.slopes().length][];
        double[] f = new double[c.continuousParents().size()];
        for (int k = 0; k < f.length; k++) {
            f[k] = factor(rng);
        }
        for (int j = 0; j < slopes.length; j++) {
            slopes[j] = c.slopes()[j].clone();
            for (int k = 0; k < f.length; k++) {
                slopes[j][k] *= f[k];
            }
        }
        double spread = 1;
        for (int k = 0; k < c.discreteParents().size(); k++) {
            spread *= factor(rng);
        }
        spread = c.discreteParents().isEmpty() ? 1 : Math.pow(spread, 1.0 / c.discreteParents().size());
        double[][] a = c.logIntercepts();
        int cats = c.categories().size();
        double[] mean = new double[cats];
        for (double[] row : a) {
            for (int j = 0; j < cats; j++) {
                mean[j] += row[j] / a.length;
            }
        }
        double[][] a2 = new double[a.length][cats];
        for (int r = 0; r < a.length; r++) {
            for (int j = 0; j < cats; j++) {
                a2[r][j] = mean[j] + spread * (a[r][j] - mean[j]);
            }
        }
        return new FittedNode.Categorical(c.name(), c.rows(), c.categories(),
                new FittedNode.Categorical.Intercepts(c.discreteParents(), a2),
                new FittedNode.Categorical.Effects(c.continuousParents(), c.centre(), c.scale(), slopes));
    }

    /** The median over continuous children of |weight| · sd(parent) / sd(child), 0 when there is none. */
    static double medianStandardisedEffect(FittedModel fitted, DataSet data) {
        List<Double> values = new ArrayList<>();
        Graph dag = fitted.dag();
        for (FittedNode n : fitted.nodes()) {
            if (n instanceof FittedNode.Gaussian g) {
                double sdChild = sd(data, dag.index(g.name()));
                for (int k = 0; k < g.weights().length; k++) {
                    double sdParent = sd(data, dag.index(g.continuousParents().get(k)));
                    if (sdChild > 0) {
                        values.add(Math.abs(g.weights()[k]) * sdParent / sdChild);
                    }
                }
            }
        }
        if (values.isEmpty()) {
            return 0;
        }
        double[] v = values.stream().mapToDouble(Double::doubleValue).toArray();
        Arrays.sort(v);
        return v.length % 2 == 1 ? v[v.length / 2] : (v[v.length / 2 - 1] + v[v.length / 2]) / 2;
    }

    /** The standard deviation of a column's observed cells (codes for a discrete column). */
    static double sd(DataSet data, int column) {
        double s = 0;
        double ss = 0;
        int m = 0;
        for (int r = 0; r < data.rows(); r++) {
            if (!data.isMissing(r, column)) {
                double x = data.value(r, column);
                s += x;
                ss += x * x;
                m++;
            }
        }
        if (m < 2) {
            return 0;
        }
        double mean = s / m;
        return Math.sqrt(Math.max(0, (ss - m * mean * mean) / (m - 1)));
    }
}

package dev.touchstone.learners.continuous;

import dev.touchstone.core.learner.RunContext;

/**
 * Minimises a smooth function over the non-negative orthant (some coordinates held at 0)
 * by a projected limited-memory BFGS method in the manner of Kim, Sra and Dhillon (2010,
 * "Tackling box-constrained optimization via a new projected quasi-Newton approach",
 * SIAM J. Sci. Comput. 32): coordinates at their bound whose gradient pushes outward are
 * fixed for the step, the L-BFGS two-loop recursion (Nocedal 1980) runs on the others,
 * and an Armijo backtracking search follows the projection arc. This stands in for the
 * L-BFGS-B solver that Zheng et al. (2018) use on the same split-variable problem.
 *
 * <p>Stops when the largest projected gradient entry is at most {@code gradientTolerance},
 * when the relative decrease of f is at most {@code relativeDecrease} (the stopping rule of
 * L-BFGS-B), or after {@code maxIterations}. Cost per iteration: one or a few function
 * evaluations plus O(memory · n).
 */
final class ProjectedLbfgs {

    /** A function with its gradient. */
    interface Objective {
        /** Returns f(x) and writes ∇f(x) into {@code gradient}. */
        double evaluate(double[] x, double[] gradient);
    }

    /** How a minimisation ended. */
    record Result(double value, int iterations, int evaluations) {
    }

    private static final double ARMIJO = 1e-4;
    private static final int MAX_BACKTRACKS = 50;

    private final int memory;
    private final int maxIterations;
    private final double gradientTolerance;
    private final double relativeDecrease;

    ProjectedLbfgs(int memory, int maxIterations, double gradientTolerance, double relativeDecrease) {
        this.memory = memory;
        this.maxIterations = maxIterations;
        this.gradientTolerance = gradientTolerance;
        this.relativeDecrease = relativeDecrease;
    }

    /**
     * Minimises {@code f} from {@code x} (updated in place, must be feasible) with the
     * coordinates flagged in {@code held} kept at 0.
     */
    Result minimise(Objective f, double[] x, boolean[] held, RunContext context) {
        int n = x.length;
        double[] g = new double[n];
        double[] gNew = new double[n];
        double[] xNew = new double[n];
        double[] direction = new double[n];
        boolean[] free = new boolean[n];
        double[][] s = new double[memory][n];
        double[][] y = new double[memory][n];
        double[] alpha = new double[memory];
        int stored = 0;
        int newest = -1;
        double fx = f.evaluate(x, g);
        int evaluations = 1;
        int iteration = 0;
        while (iteration < maxIterations) {
            context.checkDeadline();
            double projected = 0;
            for (int i = 0; i < n; i++) {
                free[i] = !held[i] && !(x[i] <= 0 && g[i] > 0);
                if (free[i]) {
                    projected = Math.max(projected, Math.abs(g[i]));
                }
            }
            if (projected <= gradientTolerance) {
                break;
            }
            iteration++;
            // Two-loop recursion restricted to the free coordinates.
            for (int i = 0; i < n; i++) {
                direction[i] = free[i] ? -g[i] : 0;
            }
            double gamma = 1;
            boolean usedPairs = false;
            for (int k = 0; k < stored; k++) {
                int slot = Math.floorMod(newest - k, memory);
                double sy = dotFree(s[slot], y[slot], free);
                if (sy <= 1e-12 * Math.sqrt(dotFree(y[slot], y[slot], free) * dotFree(s[slot], s[slot], free))
                        || sy <= 0) {
                    alpha[slot] = Double.NaN;
                    continue;
                }
                alpha[slot] = dotFree(s[slot], direction, free) / sy;
                axpyFree(-alpha[slot], y[slot], direction, free);
                if (!usedPairs) {
                    gamma = sy / dotFree(y[slot], y[slot], free);
                    usedPairs = true;
                }
            }
            for (int i = 0; i < n; i++) {
                direction[i] *= gamma;
            }
            for (int k = stored - 1; k >= 0; k--) {
                int slot = Math.floorMod(newest - k, memory);
                if (Double.isNaN(alpha[slot])) {
                    continue;
                }
                double sy = dotFree(s[slot], y[slot], free);
                double beta = dotFree(y[slot], direction, free) / sy;
                axpyFree(alpha[slot] - beta, s[slot], direction, free);
            }
            double slope = 0;
            for (int i = 0; i < n; i++) {
                slope += g[i] * direction[i];
            }
            if (!(slope < 0)) {
                stored = 0;
                slope = 0;
                for (int i = 0; i < n; i++) {
                    direction[i] = free[i] ? -g[i] : 0;
                    slope += g[i] * direction[i];
                }
            }
            double step = 1;
            if (stored == 0) {
                // Without curvature information, a first step of unit length in x.
                double norm = Math.sqrt(-slope);
                step = norm > 0 ? Math.min(1, 1 / norm) : 1;
            }
            double fNew = Double.NaN;
            boolean accepted = false;
            for (int b = 0; b < MAX_BACKTRACKS; b++) {
                double decrease = 0;
                for (int i = 0; i < n; i++) {
                    double v = held[i] ? 0 : Math.max(0, x[i] + step * direction[i]);
                    xNew[i] = v;
                    decrease += g[i] * (v - x[i]);
                }
                fNew = f.evaluate(xNew, gNew);
                evaluations++;
                if (fNew <= fx + ARMIJO * decrease) {
                    accepted = true;
                    break;
                }
                step *= 0.5;
            }
            if (!accepted) {
                break;
            }
            newest = (newest + 1) % memory;
            for (int i = 0; i < n; i++) {
                s[newest][i] = xNew[i] - x[i];
                y[newest][i] = gNew[i] - g[i];
            }
            stored = Math.min(stored + 1, memory);
            double previous = fx;
            System.arraycopy(xNew, 0, x, 0, n);
            System.arraycopy(gNew, 0, g, 0, n);
            fx = fNew;
            if ((previous - fx) <= relativeDecrease * Math.max(Math.max(Math.abs(previous), Math.abs(fx)), 1)) {
                break;
            }
        }
        return new Result(fx, iteration, evaluations);
    }

    private static double dotFree(double[] a, double[] b, boolean[] free) {
        double t = 0;
        for (int i = 0; i < a.length; i++) {
            if (free[i]) {
                t += a[i] * b[i];
            }
        }
        return t;
    }

    private static void axpyFree(double a, double[] x, double[] y, boolean[] free) {
        for (int i = 0; i < x.length; i++) {
            if (free[i]) {
                y[i] += a * x[i];
            }
        }
    }
}

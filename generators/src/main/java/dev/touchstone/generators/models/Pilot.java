package dev.touchstone.generators.models;

import dev.touchstone.core.random.Seeds;

/**
 * A pilot draw built up variable by variable while a model is drawn, so that each new
 * mechanism can centre and scale its parents by their pilot moments. Its rows come from
 * their own seed, so the pilot never touches the streams of real samples.
 */
final class Pilot {

    private final Object[] columns;
    private final double[] mean;
    private final double[] sd;
    private final long seed;
    private final String[] names;

    Pilot(String[] names, long seed) {
        this.names = names;
        this.columns = new Object[names.length];
        this.mean = new double[names.length];
        this.sd = new double[names.length];
        this.seed = seed;
    }

    /** Fills variable {@code v}'s pilot column with its final mechanism and records its moments. */
    void add(int v, NodeMechanism mechanism) {
        mechanism.fill(columns, ModelOptions.PILOT_ROWS, Seeds.random(Seeds.derive(seed, "pilot", names[v])));
        if (columns[v] instanceof double[]) {
            double[] m = Moments.of((double[]) columns[v], ModelOptions.PILOT_ROWS);
            mean[v] = m[0];
            sd[v] = m[1] > 0 ? m[1] : 1.0;
        } else {
            mean[v] = Double.NaN;
            sd[v] = Double.NaN;
        }
    }

    Object[] columns() {
        return columns;
    }

    double mean(int v) {
        return mean[v];
    }

    double sd(int v) {
        return sd[v];
    }
}

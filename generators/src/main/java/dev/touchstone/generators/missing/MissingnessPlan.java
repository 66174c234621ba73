package dev.touchstone.generators.missing;

import dev.touchstone.core.data.DataSet;
import dev.touchstone.core.random.Seeds;
import org.apache.commons.rng.UniformRandomProvider;

import java.util.ArrayList;
import java.util.HashMap;
import java.util.List;
import java.util.Map;

/**
 * The fixed missingness of one truth: a {@link MissingnessDriver} per affected variable.
 * Applying it to a complete sample masks cells row by row, each variable with its own
 * random stream ({@code Seeds.derive(seed, "missing", variable)}, one uniform draw per
 * row), so the masks of a small sample are the prefix of those of a large one. Drivers
 * are read from the complete (unmasked) values, hidden variables included. Immutable.
 * Cost O(rows · affected variables).
 */
public final class MissingnessPlan {

    private static final MissingnessPlan NONE = new MissingnessPlan(List.of());

    private final List<MissingnessDriver> drivers;

    public MissingnessPlan(List<MissingnessDriver> drivers) {
        this.drivers = List.copyOf(drivers);
    }

    /** No missing values. */
    public static MissingnessPlan none() {
        return NONE;
    }

    public List<MissingnessDriver> drivers() {
        return drivers;
    }

    public boolean isEmpty() {
        return drivers.isEmpty();
    }

    /**
     * The complete sample with cells masked (NaN or the missing code); unaffected columns
     * are shared, affected ones copied.
     */
    public DataSet apply(DataSet complete, long seed) {
        if (drivers.isEmpty()) {
            return complete;
        }
        Map<String, MissingnessDriver> byVariable = new HashMap<>();
        for (MissingnessDriver d : drivers) {
            byVariable.put(d.variable(), d);
        }
        int rows = complete.rows();
        DataSet.Builder b = DataSet.builder(rows);
        for (int j = 0; j < complete.columns(); j++) {
            String name = complete.variable(j).name();
            MissingnessDriver d = byVariable.get(name);
            boolean[] mask = d == null ? null : mask(complete, d, seed);
            if (complete.isDiscrete(j)) {
                int[] codes = complete.discrete(j);
                if (mask != null) {
                    codes = codes.clone();
                    for (int r = 0; r < rows; r++) {
                        if (mask[r]) {
                            codes[r] = DataSet.MISSING_CODE;
                        }
                    }
                }
                b.discrete(complete.variable(j), codes);
            } else {
                double[] x = complete.continuous(j);
                if (mask != null) {
                    x = x.clone();
                    for (int r = 0; r < rows; r++) {
                        if (mask[r]) {
                            x[r] = Double.NaN;
                        }
                    }
                }
                b.continuous(name, x);
            }
        }
        return b.build();
    }

    private static boolean[] mask(DataSet complete, MissingnessDriver d, long seed) {
        int rows = complete.rows();
        UniformRandomProvider stream = Seeds.random(Seeds.derive(seed, "missing", d.variable()));
        boolean[] mask = new boolean[rows];
        int driver = d.driver() == null ? -1 : complete.indexOf(d.driver());
        if (d.driver() != null && driver < 0) {
            throw new IllegalArgumentException("missingness of '" + d.variable() + "' is driven by '" + d.driver()
                    + "', which the complete sample lacks");
        }
        for (int r = 0; r < rows; r++) {
            double p = driver < 0 ? d.rate() : d.probability(complete.value(r, driver));
            mask[r] = stream.nextDouble() < p;
        }
        return mask;
    }

    /** The affected variables, in plan order. */
    public List<String> variables() {
        List<String> out = new ArrayList<>();
        for (MissingnessDriver d : drivers) {
            out.add(d.variable());
        }
        return out;
    }
}

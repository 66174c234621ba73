package dev.touchstone.generators.missing;

import dev.touchstone.core.data.DataSet;
import dev.touchstone.core.graph.Graph;
import dev.touchstone.core.param.ParameterException;
import dev.touchstone.core.param.ParameterSpec;
import dev.touchstone.core.param.ParameterValues;
import dev.touchstone.core.random.Shuffles;
import dev.touchstone.generators.Registry;
import org.apache.commons.rng.UniformRandomProvider;

import java.util.ArrayList;
import java.util.List;

/**
 * The built-in missing-value mechanisms, in the taxonomy of Rubin (1976, "Inference and
 * missing data", Biometrika 63) and in the spirit of the simulations of Tu et al. (2019,
 * "Causal discovery in the presence of missing data", AISTATS), where each missingness
 * indicator has one cause:
 * <ul>
 * <li>{@code none}: no missing values;</li>
 * <li>{@code mcar}: cells go missing with the variable's rate, independently of everything;</li>
 * <li>{@code mar}: a variable's missingness is driven, through a logistic link, by another
 *     observed variable that is itself never missing;</li>
 * <li>{@code mnar}: driven by the variable itself ({@code driver = self}) or by a hidden
 *     variable ({@code driver = hidden}; needs hidden variables).</li>
 * </ul>
 * A random {@code affected_fraction} of the observed variables lose values; each gets a
 * rate uniform in [rate − rate_spread, rate + rate_spread] (clipped to [0, 0.95]). The
 * link's intercept is calibrated by bisection so that the mean pilot probability equals
 * the rate. Cost of planning O(affected · pilot rows · 60).
 */
public final class MissingnessMechanisms {

    public static final String NONE = "none";
    public static final String MCAR = "mcar";
    public static final String MAR = "mar";
    public static final String MNAR = "mnar";

    static final ParameterSpec RATE = ParameterSpec.real("rate", 0.1, 0.0, 0.95,
            "mean fraction of missing cells in an affected variable");
    static final ParameterSpec RATE_SPREAD = ParameterSpec.real("rate_spread", 0.0, 0.0, 0.5,
            "per-variable rates are uniform in [rate - rate_spread, rate + rate_spread]");
    static final ParameterSpec AFFECTED = ParameterSpec.real("affected_fraction", 0.5, 0.0, 1.0,
            "fraction of the observed variables that lose values (at least one)");
    static final ParameterSpec STRENGTH = ParameterSpec.real("strength", 2.0, 0.0, 50.0,
            "slope of the logistic link per standard deviation of the driver");
    static final ParameterSpec DRIVER = ParameterSpec.choice("driver", "self", List.of("self", "hidden"),
            "what drives the missingness: the variable itself or a hidden variable");

    private static final List<MissingnessMechanism> ALL = List.of(
            new Mechanism(NONE, "no missing values", List.of()),
            new Mechanism(MCAR, "missing completely at random, with per-variable rates",
                    List.of(RATE, RATE_SPREAD, AFFECTED)),
            new Mechanism(MAR, "missing at random: driven by another, fully observed variable (logistic link)",
                    List.of(RATE, RATE_SPREAD, AFFECTED, STRENGTH)),
            new Mechanism(MNAR, "missing not at random: driven by the variable itself or by a hidden variable",
                    List.of(RATE, RATE_SPREAD, AFFECTED, STRENGTH, DRIVER)));

    private MissingnessMechanisms() {
    }

    public static List<MissingnessMechanism> all() {
        return ALL;
    }

    /**
     * The mechanism with this id.
     *
     * @throws IllegalArgumentException naming the id and listing the known ones
     */
    public static MissingnessMechanism byId(String id) {
        return Registry.byId(ALL, MissingnessMechanism::id, "missingness mechanism", id);
    }

    private record Mechanism(String id, String summary, List<ParameterSpec> parameters)
            implements MissingnessMechanism {

        @Override
        public String publication() {
            return "Rubin (1976), Inference and missing data; Tu et al. (2019), Causal discovery in the presence of "
                    + "missing data, AISTATS";
        }

        @Override
        public MissingnessPlan plan(Graph truth, DataSet pilot, ParameterValues values, UniformRandomProvider random) {
            if (id.equals(NONE)) {
                return MissingnessPlan.none();
            }
            double rate = values.getDouble(RATE.name());
            double spread = values.getDouble(RATE_SPREAD.name());
            double fraction = values.getDouble(AFFECTED.name());
            int[] observed = truth.observedIndices();
            List<Integer> pool = new ArrayList<>();
            for (int v : observed) {
                pool.add(v);
            }
            int affected = Math.max(1, (int) Math.round(fraction * observed.length));
            if (id.equals(MAR) && affected >= observed.length) {
                affected = observed.length - 1;
                if (affected < 1) {
                    throw new ParameterException(AFFECTED.name(), "missingness 'mar' needs at least two observed "
                            + "variables: one to lose values and one to drive it");
                }
            }
            Shuffles.shuffle(random, pool);
            List<Integer> lose = new ArrayList<>(pool.subList(0, affected));
            List<Integer> complete = new ArrayList<>(pool.subList(affected, pool.size()));
            List<Integer> hidden = new ArrayList<>();
            for (int v = 0; v < truth.size(); v++) {
                if (truth.isHidden(v)) {
                    hidden.add(v);
                }
            }
            boolean byHidden = id.equals(MNAR) && values.getString(DRIVER.name()).equals("hidden");
            if (byHidden && hidden.isEmpty()) {
                throw new ParameterException(DRIVER.name(), "missingness 'mnar' with driver = hidden needs hidden "
                        + "variables, and this truth has none (set a hidden option)");
            }
            lose.sort(null);
            List<MissingnessDriver> out = new ArrayList<>();
            for (int v : lose) {
                double r = Math.min(0.95, Math.max(0.0, rate + spread * (2 * random.nextDouble() - 1)));
                String name = truth.name(v);
                if (id.equals(MCAR)) {
                    out.add(MissingnessDriver.completelyAtRandom(name, r));
                    continue;
                }
                int driver;
                if (id.equals(MAR)) {
                    driver = complete.get(random.nextInt(complete.size()));
                } else if (byHidden) {
                    driver = hidden.get(random.nextInt(hidden.size()));
                } else {
                    driver = v;
                }
                out.add(calibrated(name, id, truth.name(driver), r, values.getDouble(STRENGTH.name()), pilot));
            }
            return new MissingnessPlan(out);
        }
    }

    /** A logistic link whose mean probability over the pilot values of the driver is {@code rate}. */
    static MissingnessDriver calibrated(String variable, String mechanism, String driver, double rate, double slope,
                                        DataSet pilot) {
        int j = pilot.indexOf(driver);
        int n = pilot.rows();
        double[] x = new double[n];
        double sum = 0;
        for (int r = 0; r < n; r++) {
            x[r] = pilot.value(r, j);
            sum += x[r];
        }
        double centre = sum / n;
        double ss = 0;
        for (int r = 0; r < n; r++) {
            ss += (x[r] - centre) * (x[r] - centre);
        }
        double scale = Math.sqrt(ss / Math.max(1, n - 1));
        if (!(scale > 0)) {
            scale = 1;
        }
        if (rate <= 0) {
            return new MissingnessDriver(variable, mechanism, driver, rate,
                    new MissingnessDriver.Link(Double.NEGATIVE_INFINITY, slope, centre, scale));
        }
        double lo = -60;
        double hi = 60;
        for (int it = 0; it < 60; it++) {
            double mid = 0.5 * (lo + hi);
            double mean = 0;
            for (int r = 0; r < n; r++) {
                mean += 1.0 / (1.0 + Math.exp(-(mid + slope * (x[r] - centre) / scale)));
            }
            mean /= n;
            if (mean < rate) {
                lo = mid;
            } else {
                hi = mid;
            }
        }
        return new MissingnessDriver(variable, mechanism, driver, rate,
                new MissingnessDriver.Link(0.5 * (lo + hi), slope, centre, scale));
    }
}

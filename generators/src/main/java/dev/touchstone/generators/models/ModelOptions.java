package dev.touchstone.generators.models;

import dev.touchstone.core.param.ParameterSpec;
import dev.touchstone.core.param.ParameterValues;
import org.apache.commons.rng.UniformRandomProvider;

import java.util.List;

/**
 * The options every continuous model declares, and the shared weight and noise-scale
 * parameters, applied in one place.
 *
 * <p>Standardisation divides each continuous variable by a fixed scale after generation
 * (children are computed from raw parent values, as when data are standardised after
 * collection; Reisach, Seiler and Weichwald 2021). The scale is the exact population
 * standard deviation where the model gives it in closed form (linear models up to 2,000
 * variables), otherwise the standard deviation of a {@value #PILOT_ROWS}-row pilot draw
 * with its own seed. The data set's own moments are deliberately not used: they would
 * make the rows of a small sample differ from the first rows of a large one. So
 * standardised columns have mean ≈ 0 and variance ≈ 1, not exactly.
 */
public final class ModelOptions {

    /** Rows of the pilot draw used for moments where no closed form is available. */
    public static final int PILOT_ROWS = 4096;

    public static final ParameterSpec STANDARDIZE = ParameterSpec.bool("standardize", false,
            "rescale every continuous variable to mean 0 and variance 1 after generation");
    public static final ParameterSpec SHUFFLE_COLUMNS = ParameterSpec.bool("shuffle_columns", false,
            "put the observed columns in a random order instead of X1, X2, …");
    public static final ParameterSpec WEIGHT_LOW = ParameterSpec.real("edge_weight_low", 0.5, 0.0,
            Double.POSITIVE_INFINITY, "smallest absolute edge weight (or effect size)");
    public static final ParameterSpec WEIGHT_HIGH = ParameterSpec.real("edge_weight_high", 2.0, 0.0,
            Double.POSITIVE_INFINITY, "largest absolute edge weight (or effect size)");
    public static final ParameterSpec RANDOM_SIGN = ParameterSpec.bool("edge_weight_random_sign", true,
            "give each weight a random sign (else all positive)");
    public static final ParameterSpec NOISE_LOW = ParameterSpec.real("noise_scale_low", 1.0, 0.0,
            Double.POSITIVE_INFINITY, "smallest noise standard deviation");
    public static final ParameterSpec NOISE_HIGH = ParameterSpec.real("noise_scale_high", 1.0, 0.0,
            Double.POSITIVE_INFINITY, "largest noise standard deviation (equal to the smallest: all equal)");

    private ModelOptions() {
    }

    /** Weight range, sign, noise range. */
    static List<ParameterSpec> weightsAndNoise() {
        return List.of(WEIGHT_LOW, WEIGHT_HIGH, RANDOM_SIGN, NOISE_LOW, NOISE_HIGH);
    }

    /** Standardise and shuffle. */
    static List<ParameterSpec> continuousOptions() {
        return List.of(STANDARDIZE, SHUFFLE_COLUMNS);
    }

    /** The parameters of a continuous model kind: its own, then weights and noise, then standardise and shuffle. */
    static List<ParameterSpec> continuousKind(ParameterSpec... own) {
        List<ParameterSpec> out = new java.util.ArrayList<>(List.of(own));
        out.addAll(weightsAndNoise());
        out.addAll(continuousOptions());
        return List.copyOf(out);
    }

    /** A weight drawn uniformly from the declared range, with a random sign if asked. */
    static WeightDraw weights(ParameterValues values) {
        double low = values.getDouble(WEIGHT_LOW.name());
        double high = values.getDouble(WEIGHT_HIGH.name());
        checkRange(WEIGHT_LOW.name(), low, WEIGHT_HIGH.name(), high);
        return new WeightDraw(low, high, values.getBoolean(RANDOM_SIGN.name()));
    }

    /** A noise standard deviation drawn uniformly from the declared range. */
    static WeightDraw noiseScales(ParameterValues values) {
        double low = values.getDouble(NOISE_LOW.name());
        double high = values.getDouble(NOISE_HIGH.name());
        checkRange(NOISE_LOW.name(), low, NOISE_HIGH.name(), high);
        return new WeightDraw(low, high, false);
    }

    static void checkRange(String lowName, double low, String highName, double high) {
        if (low > high) {
            throw new dev.touchstone.core.param.ParameterException(lowName, "parameter '" + lowName + "' (" + low
                    + ") is larger than '" + highName + "' (" + high + ")");
        }
    }

    /**
     * Applies the standardise and shuffle options: standardisation with the given exact
     * variances (null: take moments from a pilot draw), shuffling with {@code random}.
     */
    static NodeWiseModel apply(NodeWiseModel raw, ParameterValues values, double[] exactVariance,
                               UniformRandomProvider random) {
        NodeWiseModel m = raw;
        int p = raw.graph().size();
        if (isSet(values, SHUFFLE_COLUMNS)) {
            double[] key = new double[p];
            for (int v = 0; v < p; v++) {
                key[v] = random.nextDouble();
            }
            m = m.withColumnKey(key);
        }
        long pilotSeed = random.nextLong();
        if (isSet(values, STANDARDIZE)) {
            double[] centre = new double[p];
            double[] scale = new double[p];
            if (exactVariance != null) {
                for (int v = 0; v < p; v++) {
                    scale[v] = Math.sqrt(exactVariance[v]);
                }
            } else {
                Moments mom = Moments.of(m.fillColumns(PILOT_ROWS, pilotSeed), PILOT_ROWS);
                System.arraycopy(mom.mean(), 0, centre, 0, p);
                System.arraycopy(mom.sd(), 0, scale, 0, p);
            }
            for (int v = 0; v < p; v++) {
                if (raw.variable(v).isDiscrete() || !(scale[v] > 0)) {
                    scale[v] = Double.NaN;
                }
            }
            m = m.withStandardisation(centre, scale);
        }
        return m;
    }

    /** Whether a boolean option is declared among the values and true. */
    static boolean isSet(ParameterValues values, ParameterSpec option) {
        return values.asMap().containsKey(option.name()) && values.getBoolean(option.name());
    }

    /** Draws magnitudes uniformly from [low, high], with a random sign if asked. */
    record WeightDraw(double low, double high, boolean randomSign) {
        double draw(UniformRandomProvider random) {
            double w = low + (high - low) * random.nextDouble();
            return randomSign && random.nextBoolean() ? -w : w;
        }
    }
}

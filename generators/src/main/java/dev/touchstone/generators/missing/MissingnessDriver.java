package dev.touchstone.generators.missing;

import java.util.Objects;

/**
 * One variable's missingness, as recorded in the truth: which mechanism, which variable
 * drives it (none for MCAR; another observed variable for MAR; the variable itself or a
 * hidden one for MNAR), the target rate, and the logistic link
 * P(missing) = 1 / (1 + exp(−(intercept + slope · (driver − driverCentre) / driverScale))).
 *
 * @param variable     the variable whose cells go missing
 * @param mechanism    {@code mcar}, {@code mar} or {@code mnar}
 * @param driver       the driving variable, or null for MCAR
 * @param rate         the target fraction of missing cells
 * @param intercept    the link's intercept, calibrated so the expected rate is {@code rate}
 * @param slope        the link's slope per driver standard deviation (0 for MCAR)
 * @param driverCentre the driver's pilot mean
 * @param driverScale  the driver's pilot standard deviation
 */
public record MissingnessDriver(String variable, String mechanism, String driver, double rate, double intercept,
                                double slope, double driverCentre, double driverScale) {

    public MissingnessDriver {
        Objects.requireNonNull(variable, "variable");
        Objects.requireNonNull(mechanism, "mechanism");
    }

    /** The probability that a cell goes missing when the driver has value {@code x} (ignored for MCAR). */
    public double probability(double x) {
        if (driver == null) {
            return rate;
        }
        double eta = intercept + slope * (x - driverCentre) / driverScale;
        return 1.0 / (1.0 + Math.exp(-eta));
    }

    /** Whether the driver is the variable itself. */
    public boolean isSelfMasking() {
        return variable.equals(driver);
    }
}

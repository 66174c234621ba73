package dev.touchstone.generators.missing;

import java.util.Objects;

/**
 * One variable's missingness, as recorded in the truth: which mechanism, which variable
 * drives it (none for MCAR; another observed variable for MAR; the variable itself or a
 * hidden one for MNAR), the target rate, and the logistic link
 * P(missing) = 1 / (1 + exp(−(intercept + slope · (driver − driverCentre) / driverScale))).
 *
 * @param variable  the variable whose cells go missing
 * @param mechanism {@code mcar}, {@code mar} or {@code mnar}
 * @param driver    the driving variable, or null for MCAR
 * @param rate      the target fraction of missing cells
 * @param link      the logistic link from the driver (unused for MCAR)
 */
public record MissingnessDriver(String variable, String mechanism, String driver, double rate, Link link) {

    /**
     * The logistic link of a driven mechanism.
     *
     * @param intercept    the link's intercept, calibrated so the expected rate is the target rate
     * @param slope        the link's slope per driver standard deviation (0 for MCAR)
     * @param driverCentre the driver's pilot mean
     * @param driverScale  the driver's pilot standard deviation
     */
    public record Link(double intercept, double slope, double driverCentre, double driverScale) {

        /** The link of MCAR, which no driver moves. */
        public static final Link NONE = new Link(0, 0, 0, 1);
    }

    public MissingnessDriver {
        Objects.requireNonNull(variable, "variable");
        Objects.requireNonNull(mechanism, "mechanism");
        Objects.requireNonNull(link, "link");
    }

    /** Cells of {@code variable} missing completely at random at {@code rate}. */
    public static MissingnessDriver completelyAtRandom(String variable, double rate) {
        return new MissingnessDriver(variable, MissingnessMechanisms.MCAR, null, rate, Link.NONE);
    }

    /** The probability that a cell goes missing when the driver has value {@code x} (ignored for MCAR). */
    public double probability(double x) {
        if (driver == null) {
            return rate;
        }
        double eta = link.intercept() + link.slope() * (x - link.driverCentre()) / link.driverScale();
        return 1.0 / (1.0 + Math.exp(-eta));
    }

    /** Whether the driver is the variable itself. */
    public boolean isSelfMasking() {
        return variable.equals(driver);
    }
}

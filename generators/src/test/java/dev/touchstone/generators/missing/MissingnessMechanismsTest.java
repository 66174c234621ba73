package dev.touchstone.generators.missing;

import dev.touchstone.core.data.DataSet;
import dev.touchstone.core.param.ParameterException;
import dev.touchstone.generators.SimulatedReplicate;
import dev.touchstone.generators.SimulatedTruth;
import dev.touchstone.generators.Simulation;
import dev.touchstone.generators.graphs.GraphFamilies;
import dev.touchstone.generators.hidden.HiddenOptions;
import dev.touchstone.generators.models.ModelKinds;
import org.junit.jupiter.api.DisplayName;
import org.junit.jupiter.api.Test;

import java.util.Map;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertNull;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

class MissingnessMechanismsTest {

    private static Simulation simulation(String mechanism, Map<String, ?> missing, int hidden) {
        return Simulation.builder()
                .graph(GraphFamilies.byId("erdos-renyi"), Map.of("nodes", 10, "mean_degree", 3))
                .model(ModelKinds.byId("linear-gaussian"), Map.of())
                .hidden(HiddenOptions.byId(hidden > 0 ? "random" : "none"), hidden > 0 ? Map.of("count", hidden) : Map.of())
                .missing(MissingnessMechanisms.byId(mechanism), missing)
                .build();
    }

    @Test
    @DisplayName("MCAR: each affected variable's missing share is within 4 binomial SE of its rate; others complete")
    void mcarRates() {
        SimulatedTruth t = simulation("mcar", Map.of("rate", 0.2, "rate_spread", 0.1, "affected_fraction", 0.5), 0)
                .drawTruth(5);
        assertEquals(5, t.missingnessDrivers().size());
        int n = 20_000;
        DataSet d = t.sample(n).data();
        for (MissingnessDriver m : t.missingnessDrivers()) {
            assertNull(m.driver());
            assertTrue(m.rate() >= 0.1 - 1e-12 && m.rate() <= 0.3 + 1e-12);
            double share = d.missingCount(d.indexOf(m.variable())) / (double) n;
            assertEquals(m.rate(), share, 4 * Math.sqrt(m.rate() * (1 - m.rate()) / n), m.variable());
        }
        int missingColumns = 0;
        for (int j = 0; j < d.columns(); j++) {
            missingColumns += d.missingCount(j) > 0 ? 1 : 0;
        }
        assertEquals(5, missingColumns);
    }

    /** Correlation of residuals of a and b after least-squares regression on c (partial correlation). */
    private static double partialCorrelation(double[] a, double[] b, double[] c) {
        double[] ra = residual(a, c);
        double[] rb = residual(b, c);
        return correlation(ra, rb);
    }

    private static double[] residual(double[] y, double[] x) {
        double mx = mean(x);
        double my = mean(y);
        double sxy = 0;
        double sxx = 0;
        for (int i = 0; i < y.length; i++) {
            sxy += (x[i] - mx) * (y[i] - my);
            sxx += (x[i] - mx) * (x[i] - mx);
        }
        double beta = sxy / sxx;
        double[] r = new double[y.length];
        for (int i = 0; i < y.length; i++) {
            r[i] = y[i] - my - beta * (x[i] - mx);
        }
        return r;
    }

    private static double mean(double[] x) {
        double s = 0;
        for (double v : x) {
            s += v;
        }
        return s / x.length;
    }

    private static double correlation(double[] a, double[] b) {
        double ma = mean(a);
        double mb = mean(b);
        double sab = 0;
        double saa = 0;
        double sbb = 0;
        for (int i = 0; i < a.length; i++) {
            sab += (a[i] - ma) * (b[i] - mb);
            saa += (a[i] - ma) * (a[i] - ma);
            sbb += (b[i] - mb) * (b[i] - mb);
        }
        return sab / Math.sqrt(saa * sbb);
    }

    @Test
    @DisplayName("MAR: missingness is independent of the variable's own value given its driver; MNAR self is not (Rubin 1976)")
    void marIndependentGivenDriver() {
        int n = 40_000;
        for (String mech : new String[] {"mar", "mnar"}) {
            SimulatedTruth t = simulation(mech, Map.of("rate", 0.3, "affected_fraction", 0.3, "strength", 2.0), 0)
                    .drawTruth(7);
            DataSet complete = t.completeSample(n);
            DataSet observed = t.sample(n).data();
            for (MissingnessDriver m : t.missingnessDrivers()) {
                double[] x = complete.continuous(complete.indexOf(m.variable()));
                double[] driver = complete.continuous(complete.indexOf(m.driver()));
                double[] missing = new double[n];
                int j = observed.indexOf(m.variable());
                for (int r = 0; r < n; r++) {
                    missing[r] = observed.isMissing(r, j) ? 1 : 0;
                }
                double threshold = 4 / Math.sqrt(n);
                if (mech.equals("mar")) {
                    assertTrue(!m.isSelfMasking());
                    assertTrue(observed.missingCount(observed.indexOf(m.driver())) == 0, "driver is fully observed");
                    assertTrue(Math.abs(correlation(missing, driver)) > 0.2, "driven by " + m.driver());
                    // Given the driver, the residual of X carries no information on R (linear Gaussian truth).
                    assertEquals(0.0, partialCorrelation(missing, x, driver), threshold, m.variable());
                } else {
                    assertTrue(m.isSelfMasking());
                    assertTrue(Math.abs(correlation(missing, x)) > 0.2, "self-masking " + m.variable());
                }
                double share = observed.missingCount(j) / (double) n;
                assertEquals(0.3, share, 0.03, "calibrated rate of " + m.variable());
            }
        }
    }

    @Test
    @DisplayName("MNAR by a hidden cause records a hidden driver; without hidden variables it is refused naming 'driver'")
    void mnarHidden() {
        SimulatedTruth t = simulation("mnar", Map.of("driver", "hidden", "affected_fraction", 0.4), 2).drawTruth(9);
        for (MissingnessDriver m : t.missingnessDrivers()) {
            assertTrue(t.dag().isHidden(t.dag().index(m.driver())), m.driver());
        }
        SimulatedReplicate rep = t.sample(1000);
        assertEquals(8, rep.data().columns());
        ParameterException e = assertThrows(ParameterException.class,
                () -> simulation("mnar", Map.of("driver", "hidden"), 0).drawTruth(9));
        assertEquals("driver", e.parameter());
    }
}

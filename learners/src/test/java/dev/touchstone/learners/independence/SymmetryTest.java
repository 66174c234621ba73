package dev.touchstone.learners.independence;

import dev.touchstone.core.data.DataSet;
import dev.touchstone.core.learner.LearnerInput;
import dev.touchstone.core.random.Seeds;
import dev.touchstone.generators.Simulation;
import dev.touchstone.generators.graphs.GraphFamilies;
import dev.touchstone.generators.missing.MissingnessMechanisms;
import dev.touchstone.generators.models.ModelKinds;
import org.apache.commons.rng.UniformRandomProvider;
import org.junit.jupiter.api.DisplayName;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.CsvSource;

import java.util.Map;

import static org.junit.jupiter.api.Assertions.assertEquals;

/**
 * Every test gives the same bits for (x, y | z) and (y, x | z). Independence is a symmetric
 * relation (Dawid 1979, "Conditional independence in statistical theory", JRSS B 41), and the
 * adjacency search tests each pair once at level 0 relying on it.
 */
class SymmetryTest {

    @ParameterizedTest(name = "{0} on {1} data, missing cells: {2}, {3} rows")
    @CsvSource({
            "fisher-z, linear-gaussian, false, 400",
            "fisher-z, linear-gaussian, true, 400",
            "g-square, discrete, false, 400",
            "chi-square, discrete, true, 400",
            "conditional-gaussian, conditional-gaussian, false, 400",
            "conditional-gaussian, conditional-gaussian, true, 400",
            "kci, additive-nonlinear, false, 150",
            "kci, additive-nonlinear, true, 150",
            "rcit, additive-nonlinear, false, 150",
            "rcit, additive-nonlinear, true, 150"})
    @DisplayName("p-value of (x, y | z) equals that of (y, x | z) to the bit")
    void symmetric(String test, String model, boolean missing, int rows) {
        Simulation.Builder b = Simulation.builder()
                .graph(GraphFamilies.byId("erdos-renyi"), Map.of("nodes", 8, "mean_degree", 3.0))
                .model(ModelKinds.byId(model), Map.of());
        if (missing) {
            b.missing(MissingnessMechanisms.byId(MissingnessMechanisms.MCAR), Map.of("rate", 0.1));
        }
        DataSet data = b.build().drawTruth(11L).sample(rows).data();
        IndependenceTest t = IndependenceTests.forInput(LearnerInput.of(data), test, 0.05, MissingPolicy.TEST_WISE);
        UniformRandomProvider rng = Seeds.random(5L);
        int p = data.variables().size();
        int checked = 0;
        for (int x = 0; x < p; x++) {
            for (int y = x + 1; y < p; y++) {
                int[] z = conditioningSet(rng, p, x, y);
                assertEquals(Double.doubleToLongBits(t.pValue(x, y, z)), Double.doubleToLongBits(t.pValue(y, x, z)),
                        test + " on (" + x + ", " + y + ")");
                assertEquals(t.independent(x, y, z), t.independent(y, x, z));
                checked++;
            }
        }
        assertEquals(p * (p - 1) / 2, checked);
    }

    private static int[] conditioningSet(UniformRandomProvider rng, int p, int x, int y) {
        int size = rng.nextInt(3);
        int[] z = new int[size];
        int k = 0;
        while (k < size) {
            int v = rng.nextInt(p);
            boolean used = v == x || v == y;
            for (int i = 0; i < k; i++) {
                used |= z[i] == v;
            }
            if (!used) {
                z[k++] = v;
            }
        }
        return z;
    }
}

package dev.touchstone.generators.missing;

import dev.touchstone.core.data.DataSet;
import dev.touchstone.core.graph.Graph;
import dev.touchstone.core.param.ParameterSpec;
import dev.touchstone.core.param.ParameterValues;
import org.apache.commons.rng.UniformRandomProvider;

import java.util.List;
import java.util.Map;

/**
 * A missing-value mechanism with declared parameters. {@link #plan} fixes, once per truth,
 * which variables lose values and what drives their missingness; the plan then masks
 * samples of any size.
 */
public interface MissingnessMechanism {

    /** The identifier used in study files: {@code none}, {@code mcar}, {@code mar} or {@code mnar}. */
    String id();

    String summary();

    String publication();

    List<ParameterSpec> parameters();

    /**
     * Chooses the affected variables and their drivers, calibrating each link on a pilot sample.
     *
     * @param truth  the true DAG, hidden variables flagged (drivers for MAR are observed)
     * @param pilot  a complete pilot sample of every variable, hidden ones included
     * @param random the source of the choices (owned by the caller)
     */
    MissingnessPlan plan(Graph truth, DataSet pilot, ParameterValues values, UniformRandomProvider random);

    default ParameterValues resolve(Map<String, ?> raw) {
        return ParameterValues.resolve("missingness " + id(), parameters(), raw);
    }
}

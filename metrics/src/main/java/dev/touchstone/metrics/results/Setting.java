package dev.touchstone.metrics.results;

import java.util.Map;
import java.util.StringJoiner;

/**
 * One point of a study's grid, as an ordered map of plain coordinate names to values (for
 * example {@code family=erdos-renyi, nodes=20, mean_degree=2, samples=1000}).
 *
 * <p>Values are text so that a setting reads back from CSV or JSON equal to what was written;
 * numeric coordinates are written in their plain decimal form by the study expansion. Two
 * settings are the same point when their coordinates are equal in the same order.
 */
public record Setting(Map<String, String> coordinates) {

    public Setting {
        coordinates = Records.textMap(coordinates, "setting coordinate");
    }

    /** A setting from alternating names and values: {@code of("nodes", "20", "samples", "100")}. */
    public static Setting of(String... namesAndValues) {
        if (namesAndValues.length % 2 != 0) {
            throw new IllegalArgumentException("a setting needs name/value pairs, got an odd count");
        }
        Map<String, String> m = new java.util.LinkedHashMap<>();
        for (int i = 0; i < namesAndValues.length; i += 2) {
            m.put(namesAndValues[i], namesAndValues[i + 1]);
        }
        return new Setting(m);
    }

    /** The value of one coordinate, or null when the setting has no such coordinate. */
    public String get(String name) {
        return coordinates.get(name);
    }

    /** A readable label such as {@code nodes=20, samples=100}. */
    public String label() {
        StringJoiner j = new StringJoiner(", ");
        coordinates.forEach((k, v) -> j.add(k + "=" + v));
        return j.toString();
    }

    @Override
    public String toString() {
        return label();
    }
}

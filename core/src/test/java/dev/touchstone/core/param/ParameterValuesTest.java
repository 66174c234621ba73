package dev.touchstone.core.param;

import org.junit.jupiter.api.Test;

import java.util.HashMap;
import java.util.List;
import java.util.Map;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

class ParameterValuesTest {

    private static final List<ParameterSpec> SPECS = List.of(
            ParameterSpec.real("alpha", 0.05, 0.0, 1.0, "significance level"),
            ParameterSpec.integer("depth", 3, 0, 10, "largest conditioning set"),
            ParameterSpec.bool("stable", true, "order-independent skeleton"),
            ParameterSpec.choice("test", "fisher-z", List.of("fisher-z", "g-square"), "independence test"),
            ParameterSpec.text("label", "x", "a free label"));

    private static ParameterException refused(Map<String, ?> raw) {
        return assertThrows(ParameterException.class, () -> ParameterValues.resolve("learner pc", SPECS, raw));
    }

    @Test
    void defaultsAndConversions() {
        ParameterValues v = ParameterValues.resolve("learner pc", SPECS,
                Map.of("alpha", "0.01", "depth", 2.0, "stable", "FALSE", "test", "G-Square"));
        assertEquals(0.01, v.getDouble("alpha"));
        assertEquals(2, v.getInt("depth"));
        assertEquals(Integer.class, v.get("depth").getClass());
        assertEquals(false, v.getBoolean("stable"));
        assertEquals("g-square", v.getString("test"));
        assertEquals("x", v.getString("label"));
        assertEquals(List.of("alpha", "depth", "stable", "test", "label"), List.copyOf(v.asMap().keySet()));
        assertEquals(v, ParameterValues.resolve("learner pc", SPECS,
                Map.of("alpha", 0.01, "depth", 2, "stable", false, "test", "g-square")));
        assertTrue(ParameterValues.none().asMap().isEmpty());
    }

    @Test
    void unknownNameListsTheAllowedOnes() {
        ParameterException e = refused(Map.of("alfa", 0.1));
        assertEquals("alfa", e.parameter());
        assertEquals("unknown parameter 'alfa' for learner pc (allowed: alpha, depth, stable, test, label)",
                e.getMessage());
        ParameterException none = assertThrows(ParameterException.class,
                () -> ParameterValues.resolve("learner empty", List.of(), Map.of("x", 1)));
        assertTrue(none.getMessage().contains("it has none"), none.getMessage());
    }

    @Test
    void outOfRangeNamesValueAndRange() {
        assertEquals("parameter 'alpha': 1.5 is outside the allowed range [0.0, 1.0]",
                refused(Map.of("alpha", 1.5)).getMessage());
        assertEquals("parameter 'depth': 11 is outside the allowed range [0, 10]",
                refused(Map.of("depth", "11")).getMessage());
        assertEquals("parameter 'depth': -1 is outside the allowed range [0, 10]",
                refused(Map.of("depth", -1)).getMessage());
    }

    @Test
    void wrongTypeNamesWhatWasExpected() {
        assertEquals("parameter 'alpha': 'small' is not a number", refused(Map.of("alpha", "small")).getMessage());
        assertEquals("parameter 'alpha': 'NaN' is not a finite number", refused(Map.of("alpha", "NaN")).getMessage());
        assertEquals("parameter 'depth': '2.5' is not a whole number", refused(Map.of("depth", "2.5")).getMessage());
        assertEquals("parameter 'depth': '2.5' is not a whole number", refused(Map.of("depth", 2.5)).getMessage());
        assertEquals("parameter 'stable': 'yes' is not true or false", refused(Map.of("stable", "yes")).getMessage());
        assertEquals("parameter 'test': 'chi' is not allowed (allowed: fisher-z, g-square)",
                refused(Map.of("test", "chi")).getMessage());
    }

    @Test
    void missingRequiredNamesOwnerAndAllowedValues() {
        List<ParameterSpec> specs = List.of(ParameterSpec.real("alpha", 0.5, 0.0, 1.0,
                "significance level").required());
        ParameterException e = assertThrows(ParameterException.class,
                () -> ParameterValues.resolve("learner pc", specs, new HashMap<>()));
        assertEquals("parameter 'alpha' of learner pc is required (allowed: [0.0, 1.0])", e.getMessage());
    }

    @Test
    void declarationsAreChecked() {
        assertThrows(IllegalArgumentException.class, () -> ParameterSpec.integer("k", 20, 0, 10, "bad default"));
        assertThrows(IllegalArgumentException.class,
                () -> new ParameterSpec("k", new ParameterSpec.Domain(ParameterType.CHOICE, null, null, List.of()), "a",
                        "no choices"));
        IllegalArgumentException e = assertThrows(IllegalArgumentException.class,
                () -> new ParameterSpec("k", ParameterSpec.Domain.range(ParameterType.REAL, 2.0, 1.0), 1.0, "min above max"));
        assertTrue(e.getMessage().contains("min 2.0 > max 1.0"), e.getMessage());
        assertEquals("[-inf, inf]", ParameterSpec.real("w", 0, Double.NEGATIVE_INFINITY,
                Double.POSITIVE_INFINITY, "open").allowed());
    }

    @Test
    void unknownValueLookupIsRefused() {
        ParameterValues v = ParameterValues.resolve("learner pc", SPECS, Map.of());
        IllegalArgumentException e = assertThrows(IllegalArgumentException.class, () -> v.get("beta"));
        assertEquals("no parameter 'beta' was declared", e.getMessage());
    }
}

package dev.touchstone.core.param;

import org.junit.jupiter.api.DisplayName;
import org.junit.jupiter.api.Test;

import java.util.List;
import java.util.Map;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

class FormerNamesTest {

    private static final List<ParameterSpec> SPECS = List.of(
            ParameterSpec.choice("test", "auto", List.of("auto", "conditional-gaussian"), "which test"),
            ParameterSpec.real("equivalent_sample_size", 1.0, 0.001, 1e4, "prior strength"));

    @Test
    @DisplayName("a former choice value is refused, and the message names its new spelling")
    void formerChoiceRefusedWithHint() {
        ParameterException e = assertThrows(ParameterException.class,
                () -> ParameterValues.resolve("learner x", SPECS, Map.of("test", "cg-lrt")));
        assertTrue(e.getMessage().contains("'cg-lrt' was renamed 'conditional-gaussian'"), e.getMessage());
        assertTrue(e.getMessage().contains("allowed: auto, conditional-gaussian"), e.getMessage());
    }

    @Test
    @DisplayName("a former parameter name is refused, and the message names its new spelling")
    void formerNameRefusedWithHint() {
        ParameterException e = assertThrows(ParameterException.class,
                () -> ParameterValues.resolve("learner x", SPECS, Map.of("ess", 2.0)));
        assertTrue(e.getMessage().contains("'ess' was renamed 'equivalent_sample_size'"), e.getMessage());
    }

    @Test
    @DisplayName("no hint when the new spelling is not one this owner accepts, nor for words never renamed")
    void noHintOutsideTheOwnersNames() {
        assertEquals("", FormerNames.hint("restarts", List.of("alpha")));
        assertEquals("", FormerNames.hint("sequential", List.of("sequential")));
        assertEquals(" ('original' was renamed 'sequential')", FormerNames.hint("original", List.of("sequential")));
    }
}

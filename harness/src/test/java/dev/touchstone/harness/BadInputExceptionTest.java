package dev.touchstone.harness;

import dev.touchstone.core.param.ParameterException;
import org.junit.jupiter.api.DisplayName;
import org.junit.jupiter.api.Test;

import java.io.UncheckedIOException;
import java.nio.file.NoSuchFileException;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertNull;
import static org.junit.jupiter.api.Assertions.assertSame;

/** The one place that decides what counts as bad input (exit 2) and what is a fault of the tool. */
class BadInputExceptionTest {

    @Test
    @DisplayName("bad input anywhere in the cause chain is found; a parameter refused by its declaration counts; a plain fault does not")
    void classification() {
        BadInputException bad = new BadInputException("data.csv, line 3: 'x' is not a number");
        assertSame(bad, BadInputException.from(new RuntimeException("wrapped", bad)));

        ParameterException p = new ParameterException("alpha", "parameter 'alpha': 2.0 is outside the allowed range [1.0E-12, 0.999]");
        BadInputException fromParameter = BadInputException.from(new IllegalStateException("run failed", p));
        assertEquals(p.getMessage(), fromParameter.getMessage());

        BadInputException missing = BadInputException.from(new UncheckedIOException(new NoSuchFileException("study.yaml")));
        assertEquals("study.yaml: no such file or folder (check the path)", missing.getMessage());

        assertNull(BadInputException.from(new IllegalStateException("index out of range")));
        assertNull(BadInputException.from(new IllegalArgumentException("a bug's message")));
    }
}

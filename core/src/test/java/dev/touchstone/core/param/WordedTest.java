package dev.touchstone.core.param;

import dev.touchstone.core.graph.GraphClass;
import dev.touchstone.core.graph.Mark;
import dev.touchstone.core.learner.KnowledgeUse;
import org.junit.jupiter.api.Test;

import java.util.List;
import java.util.Map;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

/**
 * Words of enums from their declared names, and typed parameters. The expected spellings are
 * the ones the study files and graph files have always used (the project's own docs).
 */
class WordedTest {

    enum Speed implements Worded { SLOW, VERY_FAST }

    @Test
    void wordsComeFromTheNames() {
        assertEquals(List.of("slow", "very-fast"), Worded.words(Speed.class));
        assertEquals("required-edges", KnowledgeUse.REQUIRED_EDGES.word());
        assertEquals("cpdag", GraphClass.CPDAG.word());
    }

    @Test
    void parsingIgnoresCaseAndBlanksAndNamesTheAllowedWords() {
        assertEquals(Speed.VERY_FAST, Worded.parse(Speed.class, " Very-Fast ", "speed"));
        assertEquals(Mark.CIRCLE, Mark.parse("circle"));
        IllegalArgumentException e = assertThrows(IllegalArgumentException.class,
                () -> Worded.parse(Speed.class, "warp", "speed"));
        assertEquals("unknown speed 'warp' (allowed: slow, very-fast)", e.getMessage());
        assertEquals("unknown mark 'dot' (allowed: tail, arrow, circle)",
                assertThrows(IllegalArgumentException.class, () -> Mark.parse("dot")).getMessage());
        assertEquals("unknown graph class 'null' (allowed: dag, cpdag, mag, pag)",
                assertThrows(IllegalArgumentException.class, () -> GraphClass.parse(null)).getMessage());
        assertTrue(Worded.find(Speed.class, "slower").isEmpty());
    }

    @Test
    void typedParametersGiveCheckedValuesOfTheirType() {
        Parameter<Speed> speed = Parameter.choice("speed", Speed.SLOW, "how fast");
        Parameter<Integer> steps = Parameter.integer("steps", 3, 1, 10, "how many");
        Parameter<Double> rate = Parameter.real("rate", 0.5, 0, 1, "how often");
        Parameter<Boolean> loud = Parameter.bool("loud", false, "whether loud");
        assertEquals(List.of("slow", "very-fast"), speed.spec().choices());
        assertEquals("slow", speed.spec().defaultValue());
        ParameterValues v = ParameterValues.resolve("learner x",
                List.of(speed.spec(), steps.spec(), rate.spec(), loud.spec()),
                Map.of("speed", "VERY-FAST", "steps", "7", "loud", "true"));
        assertEquals(Speed.VERY_FAST, v.get(speed));
        assertEquals(7, v.get(steps));
        assertEquals(0.5, v.get(rate));
        assertEquals(true, v.get(loud));
        ParameterException e = assertThrows(ParameterException.class, () -> ParameterValues.resolve("learner x",
                List.of(speed.spec()), Map.of("speed", "warp")));
        assertEquals("parameter 'speed': 'warp' is not allowed (allowed: slow, very-fast)", e.getMessage());
        Parameter<Integer> undeclared = Parameter.integer("other", 1, 0, 2, "not among the values");
        assertThrows(IllegalArgumentException.class, () -> v.get(undeclared));
    }
}

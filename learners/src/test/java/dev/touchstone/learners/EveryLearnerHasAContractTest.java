package dev.touchstone.learners;

import dev.touchstone.core.learner.Learner;
import dev.touchstone.core.learner.LearnerContractTest;
import org.junit.jupiter.api.Test;

import java.util.ArrayList;
import java.util.List;
import java.util.ServiceLoader;

import static org.junit.jupiter.api.Assertions.assertTrue;

/**
 * Every learner the service loader finds has a contract test beside it, named after its class
 * ({@code PcLearner} → {@code PcLearnerContractTest}) and extending core's
 * {@link LearnerContractTest}, so no registered learner escapes the contract (common practice).
 */
class EveryLearnerHasAContractTest {

    @Test
    void eachRegisteredLearnerHasItsContractTest() {
        List<String> missing = new ArrayList<>();
        int seen = 0;
        for (Learner l : ServiceLoader.load(Learner.class)) {
            seen++;
            String name = l.getClass().getName() + "ContractTest";
            try {
                if (!LearnerContractTest.class.isAssignableFrom(Class.forName(name))) {
                    missing.add(name + " (does not extend LearnerContractTest)");
                }
            } catch (ClassNotFoundException e) {
                missing.add(name);
            }
        }
        assertTrue(seen >= 19, "the built-in learners are registered: " + seen);
        assertTrue(missing.isEmpty(), "learners without a contract test: " + missing);
    }
}

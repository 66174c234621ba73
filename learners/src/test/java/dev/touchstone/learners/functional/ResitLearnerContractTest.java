package dev.touchstone.learners.functional;

import dev.touchstone.core.learner.Learner;
import dev.touchstone.core.learner.LearnerContractTest;

import java.util.Map;

class ResitLearnerContractTest extends LearnerContractTest {
    @Override
    protected Learner learner() {
        return new ResitLearner();
    }

    /** 200 of the 400 rows (a seeded subset, which the determinism check then covers too), to keep the O(n²) HSIC tests quick. */
    @Override
    protected Map<String, Object> parameters() {
        return Map.of("max_rows", 200);
    }
}

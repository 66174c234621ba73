package dev.touchstone.reports;

import java.util.List;

/** The short cautions every report carries (causal conclusions can mislead decisions about people), in one place. */
public final class Cautions {

    /** The heading above the cautions. */
    public static final String HEADING = "Read these results with care";

    /** The cautions, one line each. */
    public static final List<String> LINES = List.of(
            "Results on simulated data hold for the simulated assumptions only.",
            "Every learner rests on assumptions (acyclicity, faithfulness, no hidden confounding, functional form)"
                    + " that real data may break.",
            "A learned graph is a hypothesis, to be checked with domain knowledge and, where possible, experiments.",
            "Decisions that affect people's health or safety need qualified review, not a benchmark score.");

    private Cautions() {
    }
}

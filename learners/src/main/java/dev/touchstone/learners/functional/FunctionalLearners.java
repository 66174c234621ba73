package dev.touchstone.learners.functional;

import dev.touchstone.core.data.DataKind;
import dev.touchstone.core.graph.GraphClass;
import dev.touchstone.core.learner.LearnerDescription;
import dev.touchstone.core.learner.LearnerFamily;
import dev.touchstone.core.learner.MissingValues;

/**
 * The declaration the functional learners (DirectLiNGAM, RESIT, CAM) share, in one place:
 * continuous data without missing cells, a DAG returned, no oracle.
 */
final class FunctionalLearners {

    /** The assumption every one of them makes, listed last. */
    static final String ACYCLIC = "acyclicity and no hidden confounding";

    private FunctionalLearners() {
    }

    /** A description builder with the shared declaration filled in; the caller adds the rest and builds. */
    static LearnerDescription.Builder describe(String id, String summary, String publication) {
        return LearnerDescription.builder(id)
                .summary(summary)
                .publication(publication)
                .family(LearnerFamily.FUNCTIONAL)
                .accepts(DataKind.CONTINUOUS)
                .returns(GraphClass.DAG)
                .missingValues(MissingValues.REJECTS);
    }
}

package dev.touchstone.learners.baseline;

import dev.touchstone.core.data.DataKind;
import dev.touchstone.core.graph.GraphClass;
import dev.touchstone.core.learner.LearnerDescription;
import dev.touchstone.core.learner.LearnerFamily;
import dev.touchstone.core.learner.MissingValues;
import dev.touchstone.core.learner.OracleUse;

/**
 * The declaration shared by the baselines that ignore the data (empty graph, random DAG):
 * any data kind, missing values and oracle accepted because nothing is read, no assumption.
 * One place, so the two cannot drift apart.
 */
final class DataFreeBaseline {

    private DataFreeBaseline() {
    }

    /** A description builder with the shared declaration filled in; the caller adds parameters and builds. */
    static LearnerDescription.Builder describe(String id, String summary, String publication, GraphClass returns) {
        return LearnerDescription.builder(id)
                .summary(summary)
                .publication(publication)
                .family(LearnerFamily.BASELINE)
                .accepts(DataKind.CONTINUOUS, DataKind.DISCRETE, DataKind.MIXED)
                .returns(returns)
                .missingValues(MissingValues.OWN_METHOD)
                .oracle(OracleUse.INDEPENDENCE)
                .assumption("none: it ignores the data");
    }
}

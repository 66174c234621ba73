package dev.touchstone.learners.example;

import dev.touchstone.core.data.CovarianceMatrix;
import dev.touchstone.core.data.DataKind;
import dev.touchstone.core.graph.GraphClass;
import dev.touchstone.core.graph.MutableGraph;
import dev.touchstone.core.graph.Graph;
import dev.touchstone.core.learner.DeclaredLearner;
import dev.touchstone.core.learner.Estimate;
import dev.touchstone.core.learner.KnowledgeUse;
import dev.touchstone.core.learner.LearnerDescription;
import dev.touchstone.core.learner.LearnerFamily;
import dev.touchstone.core.learner.LearnerRun;
import dev.touchstone.core.learner.MissingValues;
import dev.touchstone.core.param.Parameter;

/**
 * The example learner of the developers' guide, written from its "add a learner" section:
 * joins every pair of variables whose absolute Pearson correlation exceeds a threshold and
 * orients each edge along the given variable order, which makes a DAG (a marginal-correlation
 * baseline; common practice, no publication). It shows the whole of a learner: its
 * declaration (a description with one typed parameter) and its algorithm; the checks every
 * run starts with come from {@link DeclaredLearner}. Registered for the tests only, in the
 * test tree's {@code META-INF/services} file. Cost: one covariance, O(n·p²).
 */
public final class CorrelationOrderLearner extends DeclaredLearner {

    static final Parameter<Double> THRESHOLD = Parameter.real("threshold", 0.1, 0.0, 1.0,
            "pairs whose absolute correlation exceeds this are joined");

    private static final LearnerDescription DESCRIPTION = LearnerDescription.builder("example-correlation-order")
            .summary("joins pairs whose absolute correlation exceeds a threshold, oriented along the variable order")
            .publication("common practice (marginal-correlation baseline; the developers' guide's example)")
            .family(LearnerFamily.BASELINE)
            .accepts(DataKind.CONTINUOUS)
            .returns(GraphClass.DAG)
            .missingValues(MissingValues.REJECTS)
            .knowledge(KnowledgeUse.FORBIDDEN_EDGES)
            .assumption("the variable order is a causal order")
            .parameter(THRESHOLD)
            .build();

    public CorrelationOrderLearner() {
        super(DESCRIPTION);
    }

    @Override
    protected Estimate run(LearnerRun run) {
        CovarianceMatrix cov = run.input().data().covariance();
        double threshold = run.get(THRESHOLD);
        MutableGraph g = Graph.builder(run.names());
        for (int i = 0; i < cov.dimension(); i++) {
            run.context().checkDeadline();
            for (int j = i + 1; j < cov.dimension(); j++) {
                double r = cov.get(i, j) / Math.sqrt(cov.get(i, i) * cov.get(j, j));
                if (Math.abs(r) > threshold && !run.knowledge().isForbidden(run.names().get(i), run.names().get(j))) {
                    g.addDirected(i, j);
                }
            }
        }
        return Estimate.of(g.freeze(), GraphClass.DAG);
    }
}

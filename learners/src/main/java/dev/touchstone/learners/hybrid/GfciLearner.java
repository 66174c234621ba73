package dev.touchstone.learners.hybrid;

import dev.touchstone.core.data.DataKind;
import dev.touchstone.core.graph.Graph;
import dev.touchstone.core.graph.GraphClass;
import dev.touchstone.core.learner.DeclaredLearner;
import dev.touchstone.core.learner.Estimate;
import dev.touchstone.core.learner.KnowledgeUse;
import dev.touchstone.core.learner.LearnerDescription;
import dev.touchstone.core.learner.LearnerFamily;
import dev.touchstone.core.learner.LearnerRun;
import dev.touchstone.core.learner.MissingValues;
import dev.touchstone.core.learner.OracleUse;
import dev.touchstone.core.param.ParameterSpec;
import dev.touchstone.learners.constraint.FciFromAdjacencies;
import dev.touchstone.learners.score.GesLearner;

import java.util.LinkedHashMap;
import java.util.Map;

/**
 * GFCI (Ogarrio, Spirtes and Ramsey 2016, "A hybrid causal search algorithm for latent variable
 * models", Proceedings of the Eighth International Conference on Probabilistic Graphical Models,
 * PMLR 52): GES's CPDAG supplies the adjacencies and the colliders, independence tests remove the
 * adjacencies hidden common causes added, and FCI's Possible-D-Sep step and Zhang's rules give a
 * PAG over the observed variables. GES runs as the {@code ges} learner ({@link GesLearner}) with
 * the score parameters given here; the constraint half is {@link FciFromAdjacencies}.
 *
 * <p>Why it works (the paper's argument, from memory): in the large-sample limit GES returns a
 * DAG model that is an I-map of the observed distribution, so its adjacencies include those of
 * the true MAG and its unshielded colliders are colliders of the MAG; the tests then remove the
 * adjacencies the MAG lacks and, with Possible-D-Sep and the complete rules, the output is the
 * true PAG. With the oracle GES scores the exact covariance and the tests are d-separation.
 *
 * <p>Cost: GES's (see {@code GesSearch}), then tests only on GES's adjacencies, then FCI's later
 * steps. Stateless and thread-safe.
 */
public final class GfciLearner extends DeclaredLearner {

    /** The learner id. */
    public static final String ID = "gfci";

    private static final GesLearner GES = new GesLearner();
    private static final LearnerDescription DESCRIPTION = describe();

    private static LearnerDescription describe() {
        LearnerDescription.Builder b = LearnerDescription.builder(ID)
                .summary("GFCI: GES's adjacencies and colliders, then FCI's tests on those adjacencies, Possible-D-Sep"
                        + " and Zhang's rules; returns a PAG and allows hidden common causes. The score search drops"
                        + " rows with missing cells; the tests follow 'missing'")
                .publication("Ogarrio, Spirtes and Ramsey (2016), A hybrid causal search algorithm for latent"
                        + " variable models, PGM (PMLR 52); GES of Chickering (2002), JMLR 3; rules of Zhang (2008),"
                        + " Artificial Intelligence 172")
                .family(LearnerFamily.HYBRID)
                .accepts(DataKind.CONTINUOUS, DataKind.DISCRETE, DataKind.MIXED)
                .returns(GraphClass.PAG)
                .missingValues(MissingValues.CONFIGURABLE)
                .knowledge(KnowledgeUse.REQUIRED_EDGES, KnowledgeUse.FORBIDDEN_EDGES, KnowledgeUse.TIERS)
                .oracle(OracleUse.COVARIANCE)
                .assumption("acyclic causal structure over observed and hidden variables")
                .assumption("causal Markov condition and faithfulness")
                .assumption("hidden common causes allowed; selection bias only with selection_bias = possible")
                .assumption("a score consistent for the data (bic or ebic for Gaussian, bdeu for discrete) and a"
                        + " test that fits them");
        for (ParameterSpec s : DelegateParameters.union(GES.description().parameters(),
                FciFromAdjacencies.parameters())) {
            b.parameter(s);
        }
        return b.build();
    }

    public GfciLearner() {
        super(DESCRIPTION);
    }

    @Override
    protected Estimate run(LearnerRun run) {
        Estimate ges = GES.learn(run.input(), run.knowledge(), DelegateParameters.part("learner " + ID,
                run.parameters(), GES.description()), run.context());
        Graph cpdag = ges.graph();
        Estimate pag = FciFromAdjacencies.run(cpdag, run.input(), run.knowledge(), DelegateParameters.part(
                "learner " + ID, run.parameters(), FciFromAdjacencies.parameters()), run.context());
        Map<String, Double> extras = new LinkedHashMap<>(pag.extras());
        for (Map.Entry<String, Double> e : ges.extras().entrySet()) {
            extras.put("ges_" + e.getKey().replace('-', '_'), e.getValue());
        }
        return new Estimate(pag.graph(), GraphClass.PAG, extras);
    }
}

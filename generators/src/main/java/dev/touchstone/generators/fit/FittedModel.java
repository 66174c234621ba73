package dev.touchstone.generators.fit;

import dev.touchstone.core.data.Variable;
import dev.touchstone.core.graph.Graph;
import dev.touchstone.core.graph.algorithms.Ancestry;
import dev.touchstone.generators.missing.MissingnessDriver;
import dev.touchstone.generators.missing.MissingnessPlan;
import dev.touchstone.generators.models.ModelAssembly;
import dev.touchstone.generators.models.StructuralModel;

import java.util.ArrayList;
import java.util.List;

/**
 * A structural model fitted to data (see {@link StructureFit}): the DAG, one
 * {@link FittedNode} per variable in graph order, the variables as the data declared them
 * and the observed rate of missing cells per variable. Immutable.
 */
public final class FittedModel {

    /** The kind id the assembled models carry. */
    public static final String KIND = "fitted";

    private final Graph dag;
    private final List<Variable> variables;
    private final List<FittedNode> nodes;
    private final double[] missingRates;

    FittedModel(Graph dag, List<Variable> variables, List<FittedNode> nodes, double[] missingRates) {
        this.dag = dag;
        this.variables = List.copyOf(variables);
        this.nodes = List.copyOf(nodes);
        this.missingRates = missingRates.clone();
    }

    /** The DAG the parameters were fitted over. */
    public Graph dag() {
        return dag;
    }

    /** The variables (names and kinds, levels of discrete ones) as in the data, in graph order. */
    public List<Variable> variables() {
        return variables;
    }

    /** The fitted mechanisms, in graph order. */
    public List<FittedNode> nodes() {
        return nodes;
    }

    /** The fitted mechanism of the variable of this name. */
    public FittedNode node(String name) {
        return nodes.get(dag.index(name));
    }

    /** The fraction of missing cells of each variable in the data fitted, in graph order. */
    public double[] missingRates() {
        return missingRates.clone();
    }

    FittedModel withNodes(List<FittedNode> replaced) {
        return new FittedModel(dag, variables, replaced, missingRates);
    }

    /** The model the generators sample from (parameters exactly as fitted). Cost O(p + edges). */
    public StructuralModel model() {
        ModelAssembly.Builder b = ModelAssembly.builder(dag);
        for (int v : Ancestry.topologicalOrder(dag)) {
            FittedNode n = nodes.get(v);
            if (n instanceof FittedNode.Gaussian g) {
                b.gaussian(g.name(), g.intercept(), g.continuousParents(), g.weights(), g.discreteParents(),
                        g.shifts(), g.noiseSd());
            } else {
                FittedNode.Categorical c = (FittedNode.Categorical) n;
                b.categorical(c.name(), c.categories(), c.discreteParents(), c.logIntercepts(),
                        c.continuousParents(), c.centre(), c.scale(), c.slopes());
            }
        }
        return b.build(KIND);
    }

    /**
     * Missing cells at each variable's observed rate, completely at random (MCAR): an
     * assumption, since the data cannot tell MCAR from MAR or MNAR (Little and Rubin 2002).
     */
    public MissingnessPlan missingness() {
        List<MissingnessDriver> drivers = new ArrayList<>();
        for (int v = 0; v < dag.size(); v++) {
            if (missingRates[v] > 0) {
                drivers.add(MissingnessDriver.completelyAtRandom(dag.name(v), missingRates[v]));
            }
        }
        return new MissingnessPlan(drivers);
    }

    /** This model as a truth to simulate from, under a name and a one-line description. */
    public FittedTruth truth(String name, String description) {
        return new FittedTruth(name, description, dag, model(), missingness());
    }
}

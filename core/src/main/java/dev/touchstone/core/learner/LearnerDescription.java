package dev.touchstone.core.learner;

import dev.touchstone.core.data.DataKind;
import dev.touchstone.core.graph.GraphClass;
import dev.touchstone.core.param.Parameter;
import dev.touchstone.core.param.ParameterSpec;

import java.util.ArrayList;
import java.util.Collections;
import java.util.EnumSet;
import java.util.List;
import java.util.Objects;
import java.util.Set;
import java.util.regex.Pattern;

/**
 * What a learner declares about itself: identity, publication, what it accepts, what it
 * returns, the knowledge it honours, its assumptions and its parameters. Immutable.
 */
public final class LearnerDescription {

    private static final Pattern ID = Pattern.compile("[a-z][a-z0-9-]*");

    private final String id;
    private final String summary;
    private final String publication;
    private final LearnerFamily family;
    private final Set<DataKind> accepts;
    private final GraphClass returns;
    private final MissingValues missingValues;
    private final Set<KnowledgeUse> knowledge;
    private final List<String> assumptions;
    private final List<ParameterSpec> parameters;
    private final OracleUse oracle;
    private final boolean takesStartGraph;

    private LearnerDescription(Builder b) {
        this.id = b.id;
        this.summary = b.summary;
        this.publication = b.publication;
        this.family = b.family;
        this.accepts = Collections.unmodifiableSet(EnumSet.copyOf(b.accepts));
        this.returns = b.returns;
        this.missingValues = b.missingValues;
        this.knowledge = Collections.unmodifiableSet(b.knowledge.isEmpty()
                ? EnumSet.noneOf(KnowledgeUse.class) : EnumSet.copyOf(b.knowledge));
        this.assumptions = List.copyOf(b.assumptions);
        this.parameters = List.copyOf(b.parameters);
        this.oracle = b.oracle;
        this.takesStartGraph = b.takesStartGraph;
    }

    /** Starts a description; {@code id} is lower-case words joined by hyphens, e.g. {@code pc-stable}. */
    public static Builder builder(String id) {
        return new Builder(id);
    }

    public String id() {
        return id;
    }

    public String summary() {
        return summary;
    }

    /** The publication the method follows ("common practice" for baselines without one). */
    public String publication() {
        return publication;
    }

    public LearnerFamily family() {
        return family;
    }

    public Set<DataKind> accepts() {
        return accepts;
    }

    public GraphClass returns() {
        return returns;
    }

    public MissingValues missingValues() {
        return missingValues;
    }

    public Set<KnowledgeUse> knowledge() {
        return knowledge;
    }

    public List<String> assumptions() {
        return assumptions;
    }

    public List<ParameterSpec> parameters() {
        return parameters;
    }

    public OracleUse oracle() {
        return oracle;
    }

    /** Whether the learner can start its search from a graph given with {@link LearnerInput#withStart}. */
    public boolean takesStartGraph() {
        return takesStartGraph;
    }

    /** The declared parameter of this name, or null. */
    public ParameterSpec parameter(String name) {
        for (ParameterSpec p : parameters) {
            if (p.name().equals(name)) {
                return p;
            }
        }
        return null;
    }

    /**
     * Checks that this learner accepts the input: data kind, missing cells, oracle, start graph.
     *
     * @throws LearnerException saying what it got and what it accepts
     */
    public void checkAccepts(LearnerInput input) {
        if (input.startGraph().isPresent() && !takesStartGraph) {
            throw new LearnerException("learner " + id + " cannot start from a given graph");
        }
        if (input.isOracle()) {
            if (oracle == OracleUse.NONE) {
                throw new LearnerException("learner " + id + " cannot use the oracle");
            }
            if (oracle == OracleUse.COVARIANCE && input.oracle().populationCovariance() == null) {
                throw new LearnerException("learner " + id + " needs the population covariance, which this truth does not provide");
            }
            return;
        }
        DataKind kind = input.data().kind();
        if (!accepts.contains(kind)) {
            List<String> words = new ArrayList<>();
            for (DataKind k : accepts) {
                words.add(k.word());
            }
            throw new LearnerException("learner " + id + " does not accept " + kind.word() + " data (accepts: "
                    + String.join(", ", words) + ")");
        }
        if (missingValues == MissingValues.REJECTS && input.data().hasMissing()) {
            throw new LearnerException("learner " + id + " does not accept missing values; the data have some");
        }
    }

    @Override
    public String toString() {
        return id + " (" + family.word() + ", returns " + returns.word() + ")";
    }

    /** Builds a {@link LearnerDescription}; id, summary, publication, family, accepts and returns are required. */
    public static final class Builder {
        private final String id;
        private String summary;
        private String publication;
        private LearnerFamily family;
        private Set<DataKind> accepts = EnumSet.noneOf(DataKind.class);
        private GraphClass returns;
        private MissingValues missingValues = MissingValues.REJECTS;
        private Set<KnowledgeUse> knowledge = EnumSet.noneOf(KnowledgeUse.class);
        private final List<String> assumptions = new ArrayList<>();
        private final List<ParameterSpec> parameters = new ArrayList<>();
        private OracleUse oracle = OracleUse.NONE;
        private boolean takesStartGraph;

        private Builder(String id) {
            if (id == null || !ID.matcher(id).matches()) {
                throw new IllegalArgumentException("learner id '" + id
                        + "' must be lower-case letters, digits and hyphens, starting with a letter");
            }
            this.id = id;
        }

        public Builder summary(String s) {
            this.summary = s;
            return this;
        }

        public Builder publication(String s) {
            this.publication = s;
            return this;
        }

        public Builder family(LearnerFamily f) {
            this.family = f;
            return this;
        }

        public Builder accepts(DataKind first, DataKind... rest) {
            this.accepts = EnumSet.of(first, rest);
            return this;
        }

        public Builder returns(GraphClass c) {
            this.returns = c;
            return this;
        }

        public Builder missingValues(MissingValues m) {
            this.missingValues = m;
            return this;
        }

        public Builder knowledge(KnowledgeUse... uses) {
            this.knowledge = uses.length == 0 ? EnumSet.noneOf(KnowledgeUse.class) : EnumSet.of(uses[0], uses);
            return this;
        }

        public Builder assumption(String a) {
            this.assumptions.add(a);
            return this;
        }

        /** Declares a typed parameter (its {@link Parameter#spec() spec}). */
        public Builder parameter(Parameter<?> p) {
            return parameter(p.spec());
        }

        public Builder parameter(ParameterSpec p) {
            for (ParameterSpec q : parameters) {
                if (q.name().equals(p.name())) {
                    throw new IllegalArgumentException("learner " + id + " declares parameter '" + p.name() + "' twice");
                }
            }
            this.parameters.add(p);
            return this;
        }

        public Builder oracle(OracleUse o) {
            this.oracle = o;
            return this;
        }

        /** Declares that the learner starts its search from the input's start graph when there is one. */
        public Builder takesStartGraph() {
            this.takesStartGraph = true;
            return this;
        }

        public LearnerDescription build() {
            require(summary, "summary");
            require(publication, "publication");
            Objects.requireNonNull(family, "learner " + id + " needs a family");
            Objects.requireNonNull(returns, "learner " + id + " needs the graph class it returns");
            if (accepts.isEmpty()) {
                throw new IllegalArgumentException("learner " + id + " must accept at least one data kind");
            }
            return new LearnerDescription(this);
        }

        private void require(String s, String what) {
            if (s == null || s.isBlank()) {
                throw new IllegalArgumentException("learner " + id + " needs a " + what);
            }
        }
    }
}

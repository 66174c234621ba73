package dev.touchstone.harness.study;

import java.util.List;

/**
 * A study (or learners) file that cannot be used: one line naming the file, line and
 * column, the field, what is wrong and what is allowed, e.g.
 * {@code study.yaml:7:12: truth.graph.nodes: -3 is outside the allowed range [1, 100000]}.
 * When validation found several independent problems ({@link StudyProblems}) this is the
 * first, its message is the first's, and {@link #problems()} lists them all.
 */
public final class StudyException extends dev.touchstone.harness.BadInputException {
    private static final long serialVersionUID = 1L;

    private final transient Node.Place place;
    private final String field;
    private final transient List<StudyException> problems;

    public StudyException(Node.Place place, String field, String problem) {
        super(place + ": " + (field == null || field.isEmpty() ? "" : field + ": ") + problem);
        this.place = place;
        this.field = field;
        this.problems = List.of(this);
    }

    private StudyException(StudyException first, List<StudyException> all) {
        super(first.getMessage());
        this.place = first.place;
        this.field = first.field;
        this.problems = List.copyOf(all);
    }

    /** The first of several problems, carrying all of them (one of them alone is returned as it is). */
    static StudyException together(List<StudyException> all) {
        return all.size() == 1 ? all.get(0) : new StudyException(all.get(0), all);
    }

    /** Every problem found, this one first; just this one unless validation collected several. */
    public List<StudyException> problems() {
        return problems == null ? List.of(this) : problems;
    }

    /** One line per problem. */
    @Override
    public List<String> lines() {
        return problems().stream().map(Throwable::getMessage).toList();
    }

    /** Where the problem is. */
    public Node.Place place() {
        return place;
    }

    /** The path of the offending field, e.g. {@code learners[0].with.alpha} (empty for the whole file). */
    public String field() {
        return field;
    }

    /** Fails at this node's place and path. */
    public static StudyException at(Node node, String problem) {
        return new StudyException(node.place(), node.path(), problem);
    }
}

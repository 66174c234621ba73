package dev.touchstone.harness.study;

/**
 * A study (or learners) file that cannot be used: one line naming the file, line and
 * column, the field, what is wrong and what is allowed, e.g.
 * {@code study.yaml:7:12: truth.graph.nodes: -3 is outside the allowed range [1, 100000]}.
 */
public final class StudyException extends dev.touchstone.harness.BadInputException {
    private static final long serialVersionUID = 1L;

    private final transient Node.Place place;
    private final String field;

    public StudyException(Node.Place place, String field, String problem) {
        super(place + ": " + (field == null || field.isEmpty() ? "" : field + ": ") + problem);
        this.place = place;
        this.field = field;
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

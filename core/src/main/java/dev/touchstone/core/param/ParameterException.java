package dev.touchstone.core.param;

/** A parameter value that is unknown, of the wrong type or out of its declared range. */
public final class ParameterException extends IllegalArgumentException {
    private static final long serialVersionUID = 1L;

    private final String parameter;

    public ParameterException(String parameter, String message) {
        super(message);
        this.parameter = parameter;
    }

    /** The name of the offending parameter. */
    public String parameter() {
        return parameter;
    }
}

package dev.fixmod.verify.vectors;

/**
 * A specification that cannot be used: the message names the file, line and column, the JSON path of the offending
 * key and what would be accepted, e.g. {@code spec.json:4:15: demapper.llr.format: 'Q5,0' is not a Q format; ...}.
 */
public final class SpecException extends IllegalArgumentException {
    private static final long serialVersionUID = 1L;

    public SpecException(String message) {
        super(message);
    }
}

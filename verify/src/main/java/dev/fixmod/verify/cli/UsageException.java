package dev.fixmod.verify.cli;

/**
 * Bad input from the user: a wrong option value, a malformed file, a missing path. The command line prints its
 * message as one line and exits with status 2, without a stack trace. Say what is wrong and where (file, line, key)
 * and what would be accepted.
 */
public final class UsageException extends RuntimeException {
    private static final long serialVersionUID = 1L;

    public UsageException(String message) {
        super(message);
    }

    public UsageException(String message, Throwable cause) {
        super(message, cause);
    }
}

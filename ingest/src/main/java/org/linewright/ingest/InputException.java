package org.linewright.ingest;

/**
 * Bad input from the user — a file, an option value, a plan — as opposed to a fault of the program. Its
 * message is one line that names what is wrong and where (file, line, column, field or key, the offending text,
 * what was expected); the command line prints it alone and exits with code 2.
 */
public class InputException extends RuntimeException {
    public InputException(String message) {
        super(message);
    }

    public InputException(String message, Throwable cause) {
        super(message, cause);
    }
}

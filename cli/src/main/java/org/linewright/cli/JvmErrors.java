package org.linewright.cli;

import java.util.Locale;

/**
 * What to tell the user when the JVM runs out of something: which resource ran out and what to change, in one
 * line. The heap and direct memory are set through {@code LINEWRIGHT_JAVA_OPTS} (read by the launcher); the work
 * in memory at once shrinks with fewer threads and smaller table blocks.
 */
final class JvmErrors {
    private JvmErrors() {
    }

    /** One line for a resource error along the cause chain of {@code t}, or null when there is none. */
    static String describe(Throwable t) {
        for (Throwable c = t; c != null; c = c.getCause() == c ? null : c.getCause()) {
            String line = describeOne(c);
            if (line != null) {
                return line;
            }
        }
        return null;
    }

    private static String describeOne(Throwable t) {
        String message = t.getMessage() == null ? "" : t.getMessage();
        String lower = message.toLowerCase(Locale.ROOT);
        long maxHeapMiB = Runtime.getRuntime().maxMemory() / (1024 * 1024);
        String less = "; or hold less at once: fewer --threads, a smaller block_points in the table plan, a narrower "
                + "--between window";
        if (t instanceof OutOfMemoryError) {
            if (lower.contains("direct buffer")) {
                return "out of memory: the JVM's direct (off-heap) memory ran out (" + message + "); give it more with "
                        + "LINEWRIGHT_JAVA_OPTS=-XX:MaxDirectMemorySize=8g" + less;
            }
            if (lower.contains("native thread")) {
                return "out of memory: no more threads could be started (" + message + "); use fewer --threads";
            }
            if (lower.contains("metaspace")) {
                return "out of memory: the JVM's class space ran out (" + message + "); raise it with "
                        + "LINEWRIGHT_JAVA_OPTS=-XX:MaxMetaspaceSize=1g";
            }
            return "out of memory: the Java heap (at most " + maxHeapMiB + " MiB now) ran out"
                    + (message.isEmpty() ? "" : " (" + message + ")") + "; give it more with "
                    + "LINEWRIGHT_JAVA_OPTS=-Xmx8g (or another size below the machine's memory)" + less;
        }
        if (t.getClass().getName().equals("org.apache.arrow.memory.OutOfMemoryException")) {
            return "out of memory: the columnar (Arrow) buffers ran out (" + ErrorReporting.oneLine(message)
                    + "); give the JVM more direct memory with LINEWRIGHT_JAVA_OPTS=-XX:MaxDirectMemorySize=8g" + less;
        }
        if (t instanceof StackOverflowError) {
            return "stack overflow: a thread's stack ran out; raise it with LINEWRIGHT_JAVA_OPTS=-Xss8m, and please "
                    + "report the command that caused it";
        }
        if (t instanceof VirtualMachineError || t instanceof LinkageError) {
            return "JVM error: " + t.getClass().getName() + (message.isEmpty() ? "" : ": " + ErrorReporting.oneLine(message))
                    + "; check the Java installation (Java 17 or newer) and LINEWRIGHT_JAVA_OPTS";
        }
        return null;
    }
}

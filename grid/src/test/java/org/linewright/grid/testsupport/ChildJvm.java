package org.linewright.grid.testsupport;

import static org.junit.jupiter.api.Assertions.assertEquals;

import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.Comparator;
import java.util.List;
import java.util.stream.Stream;

/**
 * Runs a benchmark's {@code main} in a JVM of its own, with the heap limit under test ({@code -Xmx2g}) and the test
 * class path, in a temporary work folder (its path the last argument) that is deleted afterwards. The child's output
 * is echoed as it comes, so a long run shows its phases; a non-zero exit (an OutOfMemoryError, a wrong result)
 * fails the test.
 */
public final class ChildJvm {
    private ChildJvm() {
    }

    /**
     * @param main        the class whose {@code main} runs
     * @param properties  extra {@code -Dkey=value} options
     * @param args        arguments before the work folder
     * @return the child's output
     */
    public static String run(Class<?> main, List<String> properties, String... args)
            throws IOException, InterruptedException {
        Path dir = Files.createTempDirectory("lw-bench-");
        try {
            List<String> command = new ArrayList<>();
            command.add(Path.of(System.getProperty("java.home"), "bin", "java").toString());
            command.add("-Xmx2g");
            command.add("--add-opens=java.base/java.nio=ALL-UNNAMED");
            command.addAll(properties);
            command.add("-cp");
            command.add(System.getProperty("surefire.test.class.path", System.getProperty("java.class.path")));
            command.add(main.getName());
            command.addAll(List.of(args));
            command.add(dir.toString());
            Process p = new ProcessBuilder(command).redirectErrorStream(true).start();
            StringBuilder out = new StringBuilder();
            try (var r = p.inputReader(StandardCharsets.UTF_8)) {
                String line;
                while ((line = r.readLine()) != null) {
                    System.out.println(line);
                    out.append(line).append('\n');
                }
            }
            assertEquals(0, p.waitFor(), out.toString());
            return out.toString();
        } finally {
            try (Stream<Path> walk = Files.walk(dir)) {
                walk.sorted(Comparator.reverseOrder()).forEach(f -> f.toFile().delete());
            }
        }
    }
}

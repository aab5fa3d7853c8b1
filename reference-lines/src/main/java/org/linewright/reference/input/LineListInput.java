package org.linewright.reference.input;

import java.io.IOException;
import java.nio.file.FileVisitResult;
import java.nio.file.Files;
import java.nio.file.Path;
import java.nio.file.SimpleFileVisitor;
import java.nio.file.attribute.BasicFileAttributes;
import java.util.List;
import java.util.Objects;

import org.linewright.ingest.InputException;
import org.linewright.ingest.pipeline.IngestListener;
import org.linewright.ingest.pipeline.IngestOptions;
import org.linewright.ingest.pipeline.IngestPipeline;
import org.linewright.ingest.registry.MoleculeRegistry;
import org.linewright.ingest.store.LineStore;

/**
 * A line list given to {@code verify} or {@code compare}: either a line store (a directory holding
 * {@code linestore.properties}) opened as it is, or a raw line-list file (any format and compression the ingest
 * reads) ingested strictly into a temporary store that {@link #close()} deletes.
 */
public final class LineListInput implements AutoCloseable {
    private static final String STORE_INDEX = "linestore.properties";

    private final Path given;
    private final LineStore store;
    private final Path temporaryStoreOrNull;

    private LineListInput(Path given, LineStore store, Path temporaryStoreOrNull) {
        this.given = given;
        this.store = store;
        this.temporaryStoreOrNull = temporaryStoreOrNull;
    }

    /**
     * Opens {@code path} as a store, or ingests it when it is a file.
     *
     * @param registry the isotopologue registry used to ingest a raw file
     * @throws InputException when the path is neither a store nor a readable line list (one-line message)
     */
    public static LineListInput open(Path path, MoleculeRegistry registry) throws IOException {
        Objects.requireNonNull(registry, "registry");
        if (Files.isDirectory(path)) {
            if (!Files.isRegularFile(path.resolve(STORE_INDEX))) {
                throw new InputException(path + ": a directory without " + STORE_INDEX
                        + " (expected a line store or a line-list file)");
            }
            return new LineListInput(path, LineStore.open(path), null);
        }
        if (!Files.isRegularFile(path)) {
            throw new InputException(path + ": no such file or directory (expected a line store or a line-list file)");
        }
        Path temp = Files.createTempDirectory("linewright-store-");
        try {
            IngestPipeline.run(List.of(path), temp, IngestOptions.strict(registry), IngestListener.NONE);
            return new LineListInput(path, LineStore.open(temp), temp);
        } catch (IOException | RuntimeException e) {
            deleteTree(temp);
            throw e;
        }
    }

    /** The path as given. */
    public Path path() {
        return given;
    }

    /** The store to read (the given one, or the temporary one). */
    public LineStore store() {
        return store;
    }

    /** True when the input was a raw file ingested for this run. */
    public boolean ingested() {
        return temporaryStoreOrNull != null;
    }

    /** Deletes the temporary store, if any. */
    @Override
    public void close() throws IOException {
        if (temporaryStoreOrNull != null) {
            deleteTree(temporaryStoreOrNull);
        }
    }

    private static void deleteTree(Path root) throws IOException {
        if (!Files.exists(root)) {
            return;
        }
        Files.walkFileTree(root, new SimpleFileVisitor<>() {
            @Override
            public FileVisitResult visitFile(Path file, BasicFileAttributes attrs) throws IOException {
                Files.delete(file);
                return FileVisitResult.CONTINUE;
            }

            @Override
            public FileVisitResult postVisitDirectory(Path dir, IOException exc) throws IOException {
                Files.delete(dir);
                return FileVisitResult.CONTINUE;
            }
        });
    }
}

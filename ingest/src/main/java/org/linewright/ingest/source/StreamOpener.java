package org.linewright.ingest.source;

import java.io.IOException;
import java.io.InputStream;
import java.nio.file.Path;

/** Opens a file as a stream of its (decompressed) bytes; readers of multi-file formats take one. */
@FunctionalInterface
public interface StreamOpener {
    InputStream open(Path path) throws IOException;
}

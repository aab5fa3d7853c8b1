package org.linewright.ingest.source;

import java.io.BufferedInputStream;
import java.io.IOException;
import java.io.InputStream;
import java.nio.file.Path;
import org.linewright.ingest.hitran.HitranDelimitedReader;
import org.linewright.ingest.hitran.HitranRecordReader;
import org.linewright.ingest.text.ByteLineScanner;

/**
 * Opens a line-list file of any supported format and compression: detects the compression by magic bytes
 * ({@link SourceInput}), the format from the file name and content ({@link FormatDetector}) unless given,
 * and returns the reader for it.
 *
 * <p>A format given by the caller is used as is when the content is not recognised (the reader then
 * reports the first bad record); when the content clearly is another format the open fails with a
 * one-line error naming the format found.
 */
public final class LineSources {
    private LineSources() {
    }

    /**
     * @param path the file (any of a state/transition set for {@link LineFormat#EXOMOL})
     * @param formatOrNull the format to read, or null to detect it
     * @throws LineFormatException for an empty, corrupt or unrecognised file, or a file of another format
     * @throws UnsupportedOperationException for ExoMol and catalog files until their readers are wired in
     */
    public static OpenedSource open(Path path, LineFormat formatOrNull, ReadOptions options) throws IOException {
        String name = path.toString();
        LineFormat byName = FormatDetector.byFileName(path.getFileName().toString());
        if (formatOrNull == LineFormat.EXOMOL || (formatOrNull == null && byName == LineFormat.EXOMOL)) {
            throw new UnsupportedOperationException(name + ": the ExoMol reader is not yet wired into LineSources");
        }
        SourceInput input = SourceInput.open(path);
        boolean ok = false;
        try {
            BufferedInputStream content = new BufferedInputStream(input.stream(), ByteLineScanner.DEFAULT_BUFFER_BYTES);
            content.mark(FormatDetector.HEAD_BYTES);
            byte[] head = content.readNBytes(FormatDetector.HEAD_BYTES);
            content.reset();
            if (head.length == 0) {
                throw LineFormatException.ofFile(name, "the " + input.compression().id() + " data decompress to nothing", null);
            }
            LineFormat found = FormatDetector.byContent(head, head.length);
            LineFormat format;
            if (formatOrNull == null) {
                if (found == null) {
                    throw LineFormatException.ofFile(name, "cannot recognise the format: found "
                            + FormatDetector.describe(head, head.length)
                            + " (expected hitran160, hitran-delimited, exomol or catalog; choose one with the format option)", null);
                }
                format = found;
            } else {
                if (found != null && found != formatOrNull) {
                    throw LineFormatException.ofFile(name, "expected " + formatOrNull.id() + " but the content looks like "
                            + found.id(), null);
                }
                if (found == null && FormatDetector.describe(head, head.length).startsWith("binary")) {
                    throw LineFormatException.ofFile(name, "expected " + formatOrNull.id() + " but found "
                            + FormatDetector.describe(head, head.length), null);
                }
                format = formatOrNull;
            }
            LineReader reader = reader(format, content, name, options);
            ok = true;
            return new OpenedSource(reader, format, input.compression().id(), input::sha256Hex, name);
        } finally {
            if (!ok) {
                input.close();
            }
        }
    }

    private static LineReader reader(LineFormat format, InputStream content, String name, ReadOptions options)
            throws IOException {
        switch (format) {
            case HITRAN160:
                return new HitranRecordReader(content, name, options);
            case HITRAN_DELIMITED:
                return new HitranDelimitedReader(content, name, options);
            case CATALOG:
                throw new UnsupportedOperationException(name + ": the catalog reader is not yet wired into LineSources");
            default:
                throw new UnsupportedOperationException(name + ": the ExoMol reader is not yet wired into LineSources");
        }
    }
}

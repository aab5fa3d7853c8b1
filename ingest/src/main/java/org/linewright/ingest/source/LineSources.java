package org.linewright.ingest.source;

import java.io.BufferedInputStream;
import java.io.IOException;
import java.io.InputStream;
import java.nio.file.Files;
import java.nio.file.NoSuchFileException;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import org.linewright.ingest.catalog.CatalogReader;
import org.linewright.ingest.exomol.ExomolFileSet;
import org.linewright.ingest.exomol.ExomolReader;
import org.linewright.ingest.hitran.HitranDelimitedReader;
import org.linewright.ingest.hitran.HitranRecordReader;
import org.linewright.ingest.text.ByteLineScanner;

/**
 * Opens a line-list file of any supported format and compression: detects the compression by magic bytes
 * ({@link SourceInput}), the format from the file name and content ({@link FormatDetector}) unless given,
 * and returns the reader for it.
 *
 * <p>A file whose name marks it as part of a state/transition set ({@code .states}, {@code .trans}, {@code .def},
 * {@code .pf}, {@code .broad}, compressed or not), or whose content is state/transition lines, opens the whole
 * set ({@link ExomolReader}); its provenance lists every file of the set.
 *
 * <p>A format given by the caller is used as is when the content is not recognised (the reader then
 * reports the first bad record); when the content clearly is another format the open fails with a
 * one-line error naming the format found.
 */
public final class LineSources {
    private static final int MAGIC_BYTES = 6;

    private LineSources() {
    }

    /**
     * @param path the file (any file of a state/transition set for {@link LineFormat#EXOMOL})
     * @param formatOrNull the format to read, or null to detect it
     * @param options strict or lenient reading, rejects, the isotopologue registry, batch size
     * @throws LineFormatException for an empty, corrupt or unrecognised file, or a file of another format
     */
    public static OpenedSource open(Path path, LineFormat formatOrNull, ReadOptions options) throws IOException {
        String name = path.toString();
        LineFormat byName = FormatDetector.byFileName(path.getFileName().toString());
        if (formatOrNull == LineFormat.EXOMOL || (formatOrNull == null && byName == LineFormat.EXOMOL)) {
            return openSet(path, options);
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
            if (format == LineFormat.EXOMOL) {
                // state/transition lines under a name of its own: the set is found from the name, or refused
                input.close();
                ok = true;
                return openSet(path, options);
            }
            LineReader reader = reader(format, content, name, options);
            ok = true;
            return new OpenedSource(reader, format, input.compression().id(), input::sha256Hex, name,
                    () -> List.of(new OpenedSource.FileDigest(name, input.sha256Hex())));
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
                return new CatalogReader(content, name, options);
            default:
                throw new IllegalArgumentException(name + ": " + format.id() + " is read as a set of files");
        }
    }

    /**
     * Opens the state/transition set {@code path} belongs to. Every file is hashed while the reader streams it;
     * a file not read to its end by then is hashed in a second pass when the digests are asked for.
     */
    private static OpenedSource openSet(Path path, ReadOptions options) throws IOException {
        HashingOpener opener = new HashingOpener();
        ExomolReader reader = ExomolReader.open(path, opener, options);
        ExomolFileSet set = reader.files();
        List<Path> files = new ArrayList<>();
        files.add(set.states());
        files.addAll(set.transitions());
        if (set.partitionFunction() != null) {
            files.add(set.partitionFunction());
        }
        if (set.definition() != null) {
            files.add(set.definition());
        }
        files.addAll(set.broadening().values());
        List<Path> inOrder = List.copyOf(files);
        Path given = path.toAbsolutePath().normalize();
        return new OpenedSource(reader, LineFormat.EXOMOL, compressionOf(path).id(),
                () -> opener.digests(path, List.of(given)).get(0).sha256Hex(), path.toString(),
                () -> opener.digests(path, inOrder));
    }

    /** The compression of a file by its magic bytes. */
    private static SourceInput.Compression compressionOf(Path path) throws IOException {
        byte[] magic;
        try (InputStream in = Files.newInputStream(path)) {
            magic = in.readNBytes(MAGIC_BYTES);
        } catch (NoSuchFileException e) {
            throw LineFormatException.ofFile(path.toString(), "no such file", e);
        }
        return SourceInput.byMagic(magic, magic.length);
    }
}

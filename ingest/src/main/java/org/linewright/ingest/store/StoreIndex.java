package org.linewright.ingest.store;

import java.io.IOException;
import java.io.Reader;
import java.io.StringReader;
import java.nio.channels.FileChannel;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.nio.file.StandardOpenOption;
import java.util.Properties;
import java.util.TreeMap;
import org.linewright.ingest.InputException;
import org.linewright.ingest.atomic.AtomicFile;

/**
 * The store index {@value #FILE_NAME}: a Java properties file (self-explaining, with a comment header) that
 * lists each source's name and file, with a human-readable summary (lines, wavenumber range, SHA-256,
 * format). The files' own metadata is authoritative; the index says which files make up the store.
 * Updates are atomic (temporary file, fsync, rename) and serialised by a lock file.
 */
final class StoreIndex {
    static final String FILE_NAME = "linestore.properties";
    static final String LOCK_NAME = ".linestore.lock";
    static final String KEY_FORMAT = "store.format";
    static final String KEY_COUNT = "store.sources";

    /** One index entry. */
    record Entry(String name, String fileName, long lines, double minCm1, double maxCm1, String sha256, String format) { }

    private StoreIndex() {
    }

    /** Reads the entries, keyed and ordered by source name; empty when there is no index yet. */
    static TreeMap<String, Entry> read(Path storeDir) throws IOException {
        Path index = storeDir.resolve(FILE_NAME);
        TreeMap<String, Entry> entries = new TreeMap<>();
        if (!Files.exists(index)) {
            return entries;
        }
        Properties p = new Properties();
        try (Reader r = new StringReader(Files.readString(index, StandardCharsets.UTF_8))) {
            p.load(r);
        }
        String format = p.getProperty(KEY_FORMAT);
        if (!StoreColumns.STORE_FORMAT_VERSION.equals(format)) {
            throw new InputException(index + ": key " + KEY_FORMAT + ": \"" + format + "\" (expected "
                    + StoreColumns.STORE_FORMAT_VERSION + ")");
        }
        int n = integer(index, p, KEY_COUNT);
        for (int i = 1; i <= n; i++) {
            String k = "source." + i + ".";
            String name = required(index, p, k + "name");
            String file = required(index, p, k + "file");
            if (file.contains("/") || file.contains("\\") || file.startsWith(".")) {
                throw new InputException(index + ": key " + k + "file: \"" + file + "\" (expected a file name inside the store)");
            }
            entries.put(name, new Entry(name, file, Long.parseLong(p.getProperty(k + "lines", "0")),
                    Double.parseDouble(p.getProperty(k + "wavenumber_min_cm1", "NaN")),
                    Double.parseDouble(p.getProperty(k + "wavenumber_max_cm1", "NaN")),
                    p.getProperty(k + "source_sha256", ""), p.getProperty(k + "reader_format", "")));
        }
        return entries;
    }

    /** Atomically replaces the index with these entries. */
    static void write(Path storeDir, TreeMap<String, Entry> entries) throws IOException {
        StringBuilder sb = new StringBuilder();
        sb.append("# linewright line store index (Java properties, UTF-8).\n")
          .append("# Each source is one Arrow IPC file in this directory holding its lines sorted by wavenumber;\n")
          .append("# the files' schema and footer metadata hold the full provenance and counts.\n")
          .append("# The summary keys below (lines, wavenumber range, SHA-256, format) are for reading only.\n");
        line(sb, KEY_FORMAT, StoreColumns.STORE_FORMAT_VERSION);
        line(sb, KEY_COUNT, Integer.toString(entries.size()));
        int i = 0;
        for (Entry e : entries.values()) {
            String k = "source." + (++i) + ".";
            line(sb, k + "name", e.name());
            line(sb, k + "file", e.fileName());
            line(sb, k + "lines", Long.toString(e.lines()));
            line(sb, k + "wavenumber_min_cm1", Double.toString(e.minCm1()));
            line(sb, k + "wavenumber_max_cm1", Double.toString(e.maxCm1()));
            line(sb, k + "source_sha256", e.sha256());
            line(sb, k + "reader_format", e.format());
        }
        Path tmp = AtomicFile.temporaryPathFor(storeDir.resolve(FILE_NAME));
        try (FileChannel ch = FileChannel.open(tmp, StandardOpenOption.CREATE_NEW, StandardOpenOption.WRITE)) {
            ch.write(java.nio.ByteBuffer.wrap(sb.toString().getBytes(StandardCharsets.UTF_8)));
            ch.force(true);
        } catch (IOException | RuntimeException e) {
            Files.deleteIfExists(tmp);
            throw e;
        }
        AtomicFile.rename(tmp, storeDir.resolve(FILE_NAME));
        syncDirectory(storeDir);
    }

    /** An index update, run under the store's lock. */
    @FunctionalInterface
    interface Update<T> {
        T run() throws IOException;
    }

    /** Serialises index updates within this JVM (file locks are held per JVM, not per thread). */
    private static final Object JVM_LOCK = new Object();

    /**
     * Runs {@code update} holding the store's update lock: a JVM-wide monitor (threads) and an exclusive lock
     * on {@value #LOCK_NAME} (other processes).
     */
    static <T> T locked(Path storeDir, Update<T> update) throws IOException {
        synchronized (JVM_LOCK) {
            try (FileChannel ch = FileChannel.open(storeDir.resolve(LOCK_NAME), StandardOpenOption.CREATE,
                    StandardOpenOption.WRITE)) {
                // Released when the channel closes.
                ch.lock();
                return update.run();
            }
        }
    }

    /** Forces the directory entry changes (renames) to disk where the platform allows it. */
    static void syncDirectory(Path dir) {
        try (FileChannel ch = FileChannel.open(dir, StandardOpenOption.READ)) {
            ch.force(true);
        } catch (IOException ignored) {
            // Not supported on every platform; the renames are atomic regardless.
        }
    }

    private static void line(StringBuilder sb, String key, String value) {
        sb.append(key).append('=').append(escape(value)).append('\n');
    }

    /** Escapes a value for the properties format (backslash, line breaks, leading blanks, non-ASCII). */
    static String escape(String value) {
        StringBuilder sb = new StringBuilder();
        for (int i = 0; i < value.length(); i++) {
            char ch = value.charAt(i);
            switch (ch) {
                case '\\' -> sb.append("\\\\");
                case '\n' -> sb.append("\\n");
                case '\r' -> sb.append("\\r");
                case '\t' -> sb.append("\\t");
                case '\f' -> sb.append("\\f");
                default -> {
                    if (ch == ' ' && i == 0) {
                        sb.append("\\ ");
                    } else if (ch < 0x20 || ch > 0x7e) {
                        sb.append(String.format("\\u%04x", (int) ch));
                    } else {
                        sb.append(ch);
                    }
                }
            }
        }
        return sb.toString();
    }

    private static String required(Path index, Properties p, String key) {
        String v = p.getProperty(key);
        if (v == null) {
            throw new InputException(index + ": key " + key + " is missing");
        }
        return v;
    }

    private static int integer(Path index, Properties p, String key) {
        String v = required(index, p, key);
        try {
            return Integer.parseInt(v.trim());
        } catch (NumberFormatException e) {
            throw new InputException(index + ": key " + key + ": \"" + v + "\" (expected a whole number)");
        }
    }
}

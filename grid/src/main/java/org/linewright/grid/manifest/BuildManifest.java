package org.linewright.grid.manifest;

import java.io.IOException;
import java.io.Writer;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.LinkedHashMap;
import java.util.Map;
import java.util.Properties;
import java.util.TreeMap;
import org.linewright.ingest.atomic.AtomicFile;
import org.linewright.ingest.InputException;

/**
 * The manifest of a table build, {@code WORK/manifest.properties} (Java properties, UTF-8; documented in
 * {@code docs/table-format.md}): the table it belongs to, the hash of every parameter, the block layout, the
 * hash of the lines within reach of each block, and for every (p, T, block) cell the cell's input hash, which is
 * also the name of its result file {@code blocks/<hash>.blk}. Written atomically (temporary file + rename).
 */
public final class BuildManifest {
    /** File name inside the work folder. */
    public static final String FILE_NAME = "manifest.properties";
    /** Format version. */
    public static final String FORMAT_VERSION = "1";

    private final Map<String, String> entries;

    private BuildManifest(Map<String, String> entries) {
        this.entries = entries;
    }

    /** A manifest to fill. */
    public static BuildManifest create() {
        BuildManifest m = new BuildManifest(new LinkedHashMap<>());
        m.put("manifest_format", FORMAT_VERSION);
        return m;
    }

    /** Reads a manifest; null when absent. */
    public static BuildManifest read(Path workDir) throws IOException {
        Path f = workDir.resolve(FILE_NAME);
        if (!Files.isRegularFile(f)) {
            return null;
        }
        Properties p = new Properties();
        try (var in = Files.newBufferedReader(f, StandardCharsets.UTF_8)) {
            p.load(in);
        }
        if (!FORMAT_VERSION.equals(p.getProperty("manifest_format"))) {
            throw new InputException(f + ": manifest_format \"" + p.getProperty("manifest_format") + "\" (expected "
                    + FORMAT_VERSION + ")");
        }
        Map<String, String> m = new TreeMap<>();
        p.stringPropertyNames().forEach(k -> m.put(k, p.getProperty(k)));
        return new BuildManifest(m);
    }

    /** Sets a key. */
    public void put(String key, String value) {
        entries.put(key, value);
    }

    /** Removes every key starting with {@code prefix}. */
    public void removeAll(String prefix) {
        entries.keySet().removeIf(k -> k.startsWith(prefix));
    }

    /** A key's value or null. */
    public String get(String key) {
        return entries.get(key);
    }

    /** Key of a cell's input hash. */
    public static String cellKey(int p, int t, int block) {
        return "cell." + p + "." + t + "." + block;
    }

    /** Writes the manifest atomically into {@code workDir}. */
    public void write(Path workDir) throws IOException {
        Files.createDirectories(workDir);
        Path tmp = AtomicFile.temporaryFor(workDir.resolve(FILE_NAME));
        try {
            try (Writer w = Files.newBufferedWriter(tmp, StandardCharsets.UTF_8)) {
                w.write("# linewright table build manifest: cell.P.T.B = input hash of (pressure P, temperature T, block B),\n");
                w.write("# whose result is blocks/<hash>.blk\n");
                for (Map.Entry<String, String> e : entries.entrySet()) {
                    w.write(escape(e.getKey()) + "=" + escape(e.getValue()) + "\n");
                }
            }
            AtomicFile.commit(tmp, workDir.resolve(FILE_NAME));
        } finally {
            Files.deleteIfExists(tmp);
        }
    }

    private static String escape(String s) {
        StringBuilder b = new StringBuilder(s.length());
        for (int i = 0; i < s.length(); i++) {
            char c = s.charAt(i);
            switch (c) {
                case '\\' -> b.append("\\\\");
                case '\n' -> b.append("\\n");
                case '=', ':', '#', '!' -> b.append('\\').append(c);
                default -> {
                    if (c < 0x20 || c > 0x7e) {
                        b.append(String.format("\\u%04x", (int) c));
                    } else {
                        b.append(c);
                    }
                }
            }
        }
        return b.toString();
    }
}

package org.linewright.ingest;

import java.io.IOException;
import java.io.InputStream;
import java.io.UncheckedIOException;
import java.util.Properties;

/** The linewright version, from the build (Maven resource filtering), for output metadata and --version. */
public final class ToolVersion {
    private static final String VERSION = load();

    private ToolVersion() {
    }

    /** The version string, e.g. {@code 0.1.0}. */
    public static String get() {
        return VERSION;
    }

    private static String load() {
        try (InputStream in = ToolVersion.class.getResourceAsStream("version.properties")) {
            if (in == null) {
                return "unknown";
            }
            Properties p = new Properties();
            p.load(in);
            return p.getProperty("version", "unknown");
        } catch (IOException e) {
            throw new UncheckedIOException(e);
        }
    }
}

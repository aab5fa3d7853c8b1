package org.linewright.ingest.exomol;

import java.io.IOException;
import java.nio.file.DirectoryStream;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.Collections;
import java.util.Comparator;
import java.util.List;
import java.util.Map;
import java.util.TreeMap;
import org.linewright.ingest.source.LineFormatException;
import org.linewright.ingest.source.SourceInput;

/**
 * The files of one state/transition set, found from any one of them. In the directory of the given file:
 * <ul>
 *   <li>{@code NAME.states} — the states (required);</li>
 *   <li>{@code NAME.trans} and/or {@code NAME__LOW-HIGH.trans} — the transitions (at least one; read in the order
 *       of the LOW wavenumber bound, then by name);</li>
 *   <li>{@code NAME.pf} — the partition function (optional), {@code NAME.def} — the definition (optional);</li>
 *   <li>{@code ISO__GAS.broad} or {@code NAME__GAS.broad} — broadening by gas GAS (optional, any number),</li>
 * </ul>
 * each possibly with a compression suffix ({@code .gz .gzip .bz2 .bzip2 .xz .zst .zstd .zip}, as
 * {@link SourceInput.Compression#bySuffix} knows them). NAME is {@code ISO__DATASET}, and
 * ISO, the part before the first {@code __}, is the isotopologue written as an isotope formula
 * (e.g. {@code 12C-16O} in {@code 12C-16O__Li2015}).
 *
 * @param name the set name NAME
 * @param isotopeFormula ISO
 * @param states the states file
 * @param transitions the transition files in reading order
 * @param partitionFunction the {@code .pf} file or null
 * @param definition the {@code .def} file or null
 * @param broadening the {@code .broad} files by gas name as written in the file name
 */
public record ExomolFileSet(String name, String isotopeFormula, Path states, List<Path> transitions,
                            Path partitionFunction, Path definition, Map<String, Path> broadening) {

    private static final String[] KINDS = {"states", "trans", "pf", "def", "broad"};

    public ExomolFileSet {
        transitions = List.copyOf(transitions);
        broadening = Collections.unmodifiableMap(new TreeMap<>(broadening));
    }

    /**
     * Finds the set that {@code anyFile} belongs to.
     *
     * @throws LineFormatException when the name does not follow the conventions above, or the states or
     *                             transition files are missing, or a file exists under two compressions
     */
    public static ExomolFileSet locate(Path anyFile) throws IOException {
        Path absolute = anyFile.toAbsolutePath();
        Path directory = absolute.getParent();
        String given = absolute.getFileName().toString();
        String plain = stripCompression(given);
        int dot = plain.lastIndexOf('.');
        String kind = dot < 0 ? "" : plain.substring(dot + 1);
        String stem = dot < 0 ? plain : plain.substring(0, dot);
        if (!List.of(KINDS).contains(kind)) {
            throw LineFormatException.ofFile(given,
                    "not a file of a state/transition set (expected a name ending in .states, .trans, .pf, .def or .broad, optionally compressed)", null);
        }
        int firstSeparator = stem.indexOf("__");
        String iso = firstSeparator < 0 ? stem : stem.substring(0, firstSeparator);
        List<Path> files = new ArrayList<>();
        try (DirectoryStream<Path> dir = Files.newDirectoryStream(directory)) {
            for (Path p : dir) {
                if (Files.isRegularFile(p)) {
                    files.add(p);
                }
            }
        }
        files.sort(Comparator.comparing(p -> p.getFileName().toString()));
        String name;
        switch (kind) {
            case "trans" -> name = stripRange(stem);
            case "broad" -> {
                // NAME__GAS.broad names its set; ISO__GAS.broad needs the one set of that isotopologue
                int last = stem.lastIndexOf("__");
                String candidate = last > 0 ? stem.substring(0, last) : stem;
                name = hasStates(files, candidate) ? candidate : uniqueStatesName(files, iso, given);
            }
            default -> name = stem;
        }
        Path states = null;
        Path pf = null;
        Path def = null;
        List<Path> trans = new ArrayList<>();
        Map<String, Path> broad = new TreeMap<>();
        for (Path p : files) {
            String f = p.getFileName().toString();
            String base = stripCompression(f);
            if (base.equals(name + ".states")) {
                states = single(states, p, name + ".states");
            } else if (base.equals(name + ".pf")) {
                pf = single(pf, p, name + ".pf");
            } else if (base.equals(name + ".def")) {
                def = single(def, p, name + ".def");
            } else if (base.endsWith(".trans") && stripRange(base.substring(0, base.length() - 6)).equals(name)) {
                trans.add(p);
            } else if (base.endsWith(".broad")) {
                String b = base.substring(0, base.length() - 6);
                String gas = null;
                if (b.startsWith(name + "__")) {
                    gas = b.substring(name.length() + 2);
                } else if (b.startsWith(iso + "__")) {
                    gas = b.substring(iso.length() + 2);
                }
                if (gas != null && !gas.isEmpty() && !gas.contains("__")) {
                    Path previous = broad.put(gas, p);
                    if (previous != null) {
                        throw LineFormatException.ofFile(f, "broadening by " + gas + " is given twice (also "
                                + previous.getFileName() + "); keep one", null);
                    }
                }
            }
        }
        if (states == null) {
            throw LineFormatException.ofFile(name + ".states",
                    "states file not found in " + directory + " (expected " + name + ".states, optionally compressed, beside " + given + ")", null);
        }
        if (trans.isEmpty()) {
            throw LineFormatException.ofFile(name + ".trans",
                    "no transition file found in " + directory + " (expected " + name + ".trans or " + name
                    + "__LOW-HIGH.trans, optionally compressed)", null);
        }
        trans.sort(Comparator.comparingLong((Path p) -> rangeStart(stripCompression(p.getFileName().toString())))
                .thenComparing(p -> p.getFileName().toString()));
        return new ExomolFileSet(name, name.contains("__") ? name.substring(0, name.indexOf("__")) : name,
                states, trans, pf, def, broad);
    }

    private static boolean hasStates(List<Path> files, String name) {
        for (Path p : files) {
            if (stripCompression(p.getFileName().toString()).equals(name + ".states")) {
                return true;
            }
        }
        return false;
    }

    private static String uniqueStatesName(List<Path> files, String iso, String given) {
        String found = null;
        for (Path p : files) {
            String base = stripCompression(p.getFileName().toString());
            if (base.endsWith(".states") && base.startsWith(iso + "__")) {
                String candidate = base.substring(0, base.length() - 7);
                if (found != null && !found.equals(candidate)) {
                    throw LineFormatException.ofFile(given, "broadening file fits two sets (" + found + ", "
                            + candidate + "); open the set by its .states or .trans file", null);
                }
                found = candidate;
            }
        }
        if (found == null) {
            throw LineFormatException.ofFile(given, "no " + iso + "__*.states file beside it (expected the states of the set)", null);
        }
        return found;
    }

    private static Path single(Path existing, Path candidate, String what) {
        if (existing != null) {
            throw LineFormatException.ofFile(what, "found twice (" + existing.getFileName() + " and "
                    + candidate.getFileName() + "); keep one", null);
        }
        return candidate;
    }

    /** Removes a trailing compression suffix ({@link SourceInput.Compression#bySuffix}), if any. */
    static String stripCompression(String fileName) {
        if (SourceInput.Compression.bySuffix(fileName) != SourceInput.Compression.NONE) {
            // every compression suffix is the text after the last dot
            return fileName.substring(0, fileName.lastIndexOf('.'));
        }
        return fileName;
    }

    /** {@code NAME__00000-00100} → {@code NAME}; other stems unchanged. */
    static String stripRange(String stem) {
        int i = stem.lastIndexOf("__");
        if (i >= 0 && isRange(stem.substring(i + 2))) {
            return stem.substring(0, i);
        }
        return stem;
    }

    private static boolean isRange(String s) {
        int dash = s.indexOf('-');
        return dash > 0 && dash < s.length() - 1 && s.substring(0, dash).chars().allMatch(Character::isDigit)
                && s.substring(dash + 1).chars().allMatch(Character::isDigit);
    }

    private static long rangeStart(String base) {
        String stem = base.substring(0, base.length() - ".trans".length());
        int i = stem.lastIndexOf("__");
        if (i >= 0 && isRange(stem.substring(i + 2))) {
            String low = stem.substring(i + 2, stem.indexOf('-', i + 2));
            return low.length() > 18 ? Long.MAX_VALUE : Long.parseLong(low);
        }
        return -1;
    }
}

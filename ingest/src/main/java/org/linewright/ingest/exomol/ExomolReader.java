package org.linewright.ingest.exomol;

import java.io.IOException;
import java.io.InputStream;
import java.nio.file.Path;
import java.util.Collections;
import java.util.EnumSet;
import java.util.LinkedHashMap;
import java.util.Locale;
import java.util.Map;
import java.util.Set;
import org.linewright.ingest.line.Broadener;
import org.linewright.ingest.line.EinsteinCoefficients;
import org.linewright.ingest.line.LineBatch;
import org.linewright.ingest.line.LineColumn;
import org.linewright.ingest.partition.PartitionTable;
import org.linewright.ingest.source.DuplicateCounter;
import org.linewright.ingest.source.DuplicateTracker;
import org.linewright.ingest.source.IsotopologueLookup;
import org.linewright.ingest.source.LineFormat;
import org.linewright.ingest.source.LineFormatException;
import org.linewright.ingest.source.LineReader;
import org.linewright.ingest.source.ReadOptions;
import org.linewright.ingest.source.StreamOpener;
import org.linewright.ingest.text.ByteLineScanner;
import org.linewright.ingest.text.DecimalParser;

/**
 * Reads a state/transition set in the ExoMol data format (J. Tennyson et al., "The ExoMol database: molecular
 * line lists for exoplanet and other hot atmospheres", J. Mol. Spectrosc. 327 (2016) 73): the states are
 * loaded once into primitive arrays, the transitions are streamed batch by batch and joined with them by state
 * id. The files are found by {@link ExomolFileSet#locate}.
 *
 * <p>Per line:
 * <ul>
 *   <li>wavenumber: the transition file's fourth column when present, else E′ − E″ (must be positive);</li>
 *   <li>{@code einsteinAS1}, {@code upperDegeneracy}/{@code lowerDegeneracy} (total degeneracies g′, g″),
 *       {@code upperEnergyCm1}/{@code lowerEnergyCm1} (E′, E″), {@code upperJ}/{@code lowerJ} from the states;</li>
 *   <li>{@code intensityCmPerMolecule}: S(296 K) from A by {@link EinsteinCoefficients#intensityFromEinsteinA},
 *       weighted by the natural abundance of the registry, with Q(296 K) from the {@code .pf} file
 *       ({@link PartitionTable} interpolation) or, without one, from the registry; the {@code .pf} table is
 *       also offered to the line store ({@link #partitionFunctions}) so that Q(T) comes from it at every
 *       temperature;</li>
 *   <li>{@code wavenumberUncertaintyCm1}: √(σ′² + σ″²) of the state energy uncertainties when the {@code .def}
 *       file announces them (independent errors assumed), else NaN;</li>
 *   <li>widths from the {@code .broad} files (see {@link BroadeningTable}) by the lower state's J″: gas
 *       {@code air} → air width and exponent, {@code self} → self width, {@code H2}, {@code He}, {@code CO2},
 *       {@code H2O} → the foreign-broadener columns; absent gases leave NaN; shifts are NaN;</li>
 *   <li>quanta (convention of this reader): global quanta = the state's labels (every states-file field after
 *       the numeric columns, joined by one blank), local quanta = the state's J field verbatim; upper/lower for
 *       the upper/lower state. Uncertainty codes, reference codes and line-mixing flag are empty; upperK is NaN.</li>
 *   <li>{@code sourceLine}: the line number in the transition file the line came from.</li>
 * </ul>
 * Memory: the states (about 50 bytes per state plus its label text, twice that while the arrays grow) and one input buffer; transitions are never
 * held beyond the current batch.
 */
public final class ExomolReader implements LineReader, DuplicateCounter {
    private static final int MAX_TRANSITION_FIELDS = 4;

    private final ExomolFileSet files;
    private final StreamOpener opener;
    private final ReadOptions options;
    private final IsotopologueLookup.Id id;
    private final double abundance;
    private final double partitionSum296K;
    private final PartitionTable partitionTable;
    private final Map<String, BroadeningTable> broadening;
    private final StateTable states;
    private final boolean hasUncertainty;

    /** Broadening tables applied to batch columns: air, self, then each foreign gas (null when absent). */
    private final BroadeningTable air;
    private final BroadeningTable self;
    private final BroadeningTable[] foreign = new BroadeningTable[Broadener.values().length];

    private int nextTransitionFile;
    private ByteLineScanner transitions;
    private String transitionFileName;
    private final int[] start = new int[MAX_TRANSITION_FIELDS];
    private final int[] end = new int[MAX_TRANSITION_FIELDS];
    private long recordsRead;
    private long recordsRejected;
    private final DuplicateTracker duplicates = new DuplicateTracker();

    private ExomolReader(ExomolFileSet files, StreamOpener opener, ReadOptions options, IsotopologueLookup.Id id,
                         double abundance, double partitionSum296K, PartitionTable partitionTable,
                         Map<String, BroadeningTable> broadening, StateTable states, boolean hasUncertainty) {
        this.files = files;
        this.opener = opener;
        this.options = options;
        this.id = id;
        this.abundance = abundance;
        this.partitionSum296K = partitionSum296K;
        this.partitionTable = partitionTable;
        this.broadening = broadening;
        this.states = states;
        this.hasUncertainty = hasUncertainty;
        BroadeningTable airTable = null;
        BroadeningTable selfTable = null;
        for (Map.Entry<String, BroadeningTable> e : broadening.entrySet()) {
            String gas = e.getKey().toLowerCase(Locale.ROOT);
            switch (gas) {
                case "air" -> airTable = e.getValue();
                case "self" -> selfTable = e.getValue();
                default -> {
                    for (Broadener b : Broadener.values()) {
                        if (b.columnPrefix().equals(gas)) {
                            foreign[b.ordinal()] = e.getValue();
                        }
                    }
                }
            }
        }
        this.air = airTable;
        this.self = selfTable;
    }

    /**
     * Opens the set that {@code anyFileOfTheSet} belongs to: locates its files, reads the definition (if any),
     * partition function (if any), broadening files and states; the transitions are read by {@link #read}.
     *
     * @param anyFileOfTheSet a states, transition, partition-function, definition or broadening file of the set
     * @param opener opens a file as decompressed bytes
     * @param options strict or lenient reading, the isotopologue registry
     * @throws LineFormatException for a missing states or transition file, an unknown isotopologue, a missing
     *                             partition sum, and for bad records of the states, {@code .pf}, {@code .def} or
     *                             {@code .broad} files (bad state records are rejected in lenient mode)
     */
    public static ExomolReader open(Path anyFileOfTheSet, StreamOpener opener, ReadOptions options) throws IOException {
        ExomolFileSet files = ExomolFileSet.locate(anyFileOfTheSet);
        String statesName = files.states().getFileName().toString();
        IsotopologueLookup lookup = options.isotopologues();
        IsotopologueLookup.Id id = lookup.byIsotopeFormula(files.isotopeFormula());
        if (id == null) {
            throw LineFormatException.ofFile(statesName, "unknown isotopologue '" + files.isotopeFormula()
                    + "' (taken from the file name, the part before '__'): add it to the isotopologue registry "
                    + "under this isotope formula, or rename the files after a known formula", null);
        }
        double abundance = lookup.naturalAbundance(id.moleculeId(), id.isotopologue());
        if (!(abundance > 0)) {
            throw LineFormatException.ofFile(statesName, "no natural abundance for isotopologue '"
                    + files.isotopeFormula() + "' (molecule " + id.moleculeId() + ", isotopologue "
                    + id.isotopologue() + ") in the registry: the line model's intensities need it", null);
        }
        ExomolDefinition definition = ExomolDefinition.NONE;
        if (files.definition() != null) {
            try (InputStream in = opener.open(files.definition())) {
                definition = ExomolDefinition.read(in, files.definition().getFileName().toString());
            }
        }
        PartitionTable pf = null;
        double q296;
        if (files.partitionFunction() != null) {
            String pfName = files.partitionFunction().getFileName().toString();
            try (InputStream in = opener.open(files.partitionFunction())) {
                pf = PartitionTable.read(in, pfName);
            }
            if (!(pf.minTemperatureK() <= LineBatch.REFERENCE_TEMPERATURE_K
                    && LineBatch.REFERENCE_TEMPERATURE_K <= pf.maxTemperatureK())) {
                throw LineFormatException.ofFile(pfName, "partition function does not cover 296 K (table spans "
                        + pf.minTemperatureK() + "-" + pf.maxTemperatureK() + " K)", null);
            }
            q296 = pf.value(LineBatch.REFERENCE_TEMPERATURE_K);
        } else {
            q296 = lookup.partitionSum(id.moleculeId(), id.isotopologue(), LineBatch.REFERENCE_TEMPERATURE_K);
            if (!(q296 > 0)) {
                throw LineFormatException.ofFile(statesName, "no " + files.name() + ".pf file and no partition sum "
                        + "for '" + files.isotopeFormula() + "' in the registry (expected one of them for Q(296 K))", null);
            }
        }
        Map<String, BroadeningTable> broadening = new LinkedHashMap<>();
        for (Map.Entry<String, Path> e : files.broadening().entrySet()) {
            try (InputStream in = opener.open(e.getValue())) {
                broadening.put(e.getKey(), BroadeningTable.read(in, e.getValue().getFileName().toString(), e.getKey()));
            }
        }
        StateTable states;
        try (InputStream in = opener.open(files.states())) {
            states = StateTable.read(in, statesName, definition, options);
        }
        return new ExomolReader(files, opener, options, id, abundance, q296, pf,
                Collections.unmodifiableMap(broadening), states, definition.uncertainty());
    }

    /** The files of the set. */
    public ExomolFileSet files() {
        return files;
    }

    /** The registry ids of the set's isotopologue. */
    public IsotopologueLookup.Id isotopologue() {
        return id;
    }

    /** The set's partition function, or null when it has no {@code .pf} file. */
    public PartitionTable partitionFunction() {
        return partitionTable;
    }

    /** The set's {@code .pf} for its isotopologue, so that the store records it; empty without one. */
    @Override
    public Map<IsotopologueLookup.Id, PartitionTable> partitionFunctions() {
        return partitionTable == null ? Map.of() : Map.of(id, partitionTable);
    }

    /** Q(296 K) used for the intensities (from the {@code .pf} file, else from the registry). */
    public double partitionSumAt296K() {
        return partitionSum296K;
    }

    /** The set's broadening tables by gas name as written in the file names (e.g. {@code H2}, {@code He}). */
    public Map<String, BroadeningTable> broadening() {
        return broadening;
    }

    /** Number of states loaded. */
    public int stateCount() {
        return states.count();
    }

    /** State records rejected in lenient mode (they are also reported to the reject sink). */
    public long statesRejected() {
        return states.rejected();
    }

    @Override
    public boolean read(LineBatch batch) throws IOException {
        batch.clear();
        while (!batch.isFull()) {
            if (transitions == null) {
                if (nextTransitionFile == files.transitions().size()) {
                    break;
                }
                Path p = files.transitions().get(nextTransitionFile++);
                transitionFileName = p.getFileName().toString();
                transitions = new ByteLineScanner(opener.open(p));
            }
            if (!transitions.next()) {
                transitions.close();
                transitions = null;
                continue;
            }
            int n = transitions.splitOnBlanks(start, end);
            if (n == 0) {
                continue;
            }
            recordsRead++;
            try {
                parseTransition(batch, n);
            } catch (LineFormatException e) {
                if (!options.lenient()) {
                    throw e;
                }
                recordsRejected++;
                options.rejects().reject(transitionFileName, transitions.lineNumber(), transitions.lineText(), e.reason());
            }
        }
        return batch.size > 0;
    }

    /** Parses the current transition line and appends it as row {@code batch.size}. */
    private void parseTransition(LineBatch batch, int n) {
        ByteLineScanner lines = transitions;
        byte[] b = lines.buffer();
        int base = lines.lineStart();
        if (n < 3 || n > MAX_TRANSITION_FIELDS) {
            throw new LineFormatException(transitionFileName, lines.lineNumber(), 0, 0, "fields", lines.lineText(),
                    "3 or 4 fields: upper id, lower id, A (s-1) [, wavenumber (cm-1)]");
        }
        int upper = stateRow(b, 0, "upper state id");
        int lower = stateRow(b, 1, "lower state id");
        double a = DecimalParser.parse(b, start[2], end[2]);
        if (!(a >= 0) || Double.isInfinite(a)) {
            throw LineFormatException.atField(transitionFileName, lines, start[2], end[2], "A", "a non-negative number in s-1");
        }
        double upperEnergy = states.energyCm1[upper];
        double lowerEnergy = states.energyCm1[lower];
        double nu;
        if (n == 4) {
            nu = DecimalParser.parse(b, start[3], end[3]);
            if (!(nu > 0) || Double.isInfinite(nu)) {
                throw LineFormatException.atField(transitionFileName, lines, start[3], end[3], "wavenumber",
                        "a positive number in cm-1");
            }
        } else {
            nu = upperEnergy - lowerEnergy;
            if (!(nu > 0)) {
                throw new LineFormatException(transitionFileName, lines.lineNumber(), start[0] - base + 1,
                        end[1] - base, "state ids", lines.lineText(), "an upper state above the lower state (E' = "
                        + upperEnergy + ", E'' = " + lowerEnergy + " cm-1)");
            }
        }
        double gUpper = states.degeneracy[upper];
        int row = batch.size;
        batch.clearOptional(row);
        batch.moleculeId[row] = id.moleculeId();
        batch.isotopologue[row] = id.isotopologue();
        batch.wavenumberCm1[row] = nu;
        batch.einsteinAS1[row] = a;
        batch.intensityCmPerMolecule[row] = EinsteinCoefficients.intensityFromEinsteinA(a, nu, gUpper, lowerEnergy,
                LineBatch.REFERENCE_TEMPERATURE_K, partitionSum296K, abundance);
        batch.upperDegeneracy[row] = gUpper;
        batch.lowerDegeneracy[row] = states.degeneracy[lower];
        batch.lowerEnergyCm1[row] = lowerEnergy;
        batch.upperEnergyCm1[row] = upperEnergy;
        double jLower = states.j[lower];
        batch.upperJ[row] = states.j[upper];
        batch.lowerJ[row] = jLower;
        if (hasUncertainty) {
            batch.wavenumberUncertaintyCm1[row] = Math.hypot(states.uncertaintyCm1[upper], states.uncertaintyCm1[lower]);
        }
        batch.airWidthCm1PerAtm[row] = air == null ? Double.NaN : air.widthAt(jLower);
        batch.airWidthExponent[row] = air == null ? Double.NaN : air.exponentAt(jLower);
        batch.selfWidthCm1PerAtm[row] = self == null ? Double.NaN : self.widthAt(jLower);
        batch.airShiftCm1PerAtm[row] = Double.NaN;
        for (int k = 0; k < foreign.length; k++) {
            if (foreign[k] != null) {
                batch.foreignWidthCm1PerAtm[k][row] = foreign[k].widthAt(jLower);
                batch.foreignWidthExponent[k][row] = foreign[k].exponentAt(jLower);
            }
        }
        batch.sourceLine[row] = lines.lineNumber();
        byte[] text = states.textBytes();
        batch.upperGlobalQuanta.append(text, states.labelsStart(upper), states.labelsEnd(upper) - states.labelsStart(upper));
        batch.lowerGlobalQuanta.append(text, states.labelsStart(lower), states.labelsEnd(lower) - states.labelsStart(lower));
        batch.upperLocalQuanta.append(text, states.jStart(upper), states.jLength(upper));
        batch.lowerLocalQuanta.append(text, states.jStart(lower), states.jLength(lower));
        batch.uncertaintyCodes.appendEmpty();
        batch.referenceCodes.appendEmpty();
        batch.lineMixingFlag.appendEmpty();
        batch.size++;
        duplicates.offer(batch, row);
    }

    private int stateRow(byte[] b, int field, String name) {
        long stateId = DecimalParser.parseInt(b, start[field], end[field]);
        if (stateId == DecimalParser.NOT_AN_INTEGER || stateId < 0) {
            throw LineFormatException.atField(transitionFileName, transitions, start[field], end[field], name,
                    "a non-negative integer");
        }
        int row = states.rowOf(stateId);
        if (row < 0) {
            throw LineFormatException.atField(transitionFileName, transitions, start[field], end[field], name,
                    "an id of " + files.states().getFileName()
                    + (states.rejected() > 0 ? " (some states were rejected)" : ""));
        }
        return row;
    }

    @Override
    public long recordsRead() {
        return recordsRead;
    }

    @Override
    public long recordsRejected() {
        return recordsRejected;
    }

    /** Kept lines identical in molecule, isotopologue, wavenumber and the four quanta texts to the line before. */
    @Override
    public long duplicatesSeen() {
        return duplicates.duplicates();
    }

    @Override
    public Set<LineColumn> columnsProvided() {
        EnumSet<LineColumn> columns = EnumSet.allOf(LineColumn.class);
        // Never filled from a state/transition set: shifts, K, and the HITRAN-style codes and flag.
        columns.remove(LineColumn.AIR_SHIFT);
        columns.remove(LineColumn.UPPER_K);
        columns.remove(LineColumn.UNCERTAINTY_CODES);
        columns.remove(LineColumn.REFERENCE_CODES);
        columns.remove(LineColumn.LINE_MIXING_FLAG);
        if (!hasUncertainty) {
            columns.remove(LineColumn.WAVENUMBER_UNCERTAINTY);
        }
        for (Broadener b : Broadener.values()) {
            LineColumn[] foreignColumns = LineColumn.foreignColumns(b);
            columns.remove(foreignColumns[2]);
            if (foreign[b.ordinal()] == null) {
                columns.remove(foreignColumns[0]);
                columns.remove(foreignColumns[1]);
            }
        }
        return Collections.unmodifiableSet(columns);
    }

    @Override
    public LineFormat format() {
        return LineFormat.EXOMOL;
    }

    @Override
    public void close() throws IOException {
        if (transitions != null) {
            transitions.close();
            transitions = null;
        }
        nextTransitionFile = files.transitions().size();
    }
}

package org.linewright.ingest.partition;

import java.nio.file.Path;
import org.linewright.ingest.InputException;

/**
 * A user's assignment of a partition-sum table file to an isotopologue, written {@code MOL/ISO=FILE}
 * (e.g. {@code 19/1=q.txt}); MOL and ISO are the molecule and local isotopologue numbers.
 *
 * @param moleculeId molecule number
 * @param isotopologue local isotopologue number
 * @param file the table file
 */
public record TableSpec(int moleculeId, int isotopologue, Path file) {

    /**
     * Parses {@code MOL/ISO=FILE}.
     *
     * @throws InputException naming the offending text and the expected form
     */
    public static TableSpec parse(String spec) {
        int eq = spec.indexOf('=');
        int slash = eq < 0 ? -1 : spec.lastIndexOf('/', eq);
        if (eq < 0 || slash < 0 || eq == spec.length() - 1) {
            throw new InputException("partition table \"" + spec + "\": expected MOL/ISO=FILE, e.g. 19/1=q.txt");
        }
        try {
            int mol = Integer.parseInt(spec.substring(0, slash).trim());
            int iso = Integer.parseInt(spec.substring(slash + 1, eq).trim());
            if (mol < 0 || iso < 0) {
                throw new NumberFormatException();
            }
            return new TableSpec(mol, iso, Path.of(spec.substring(eq + 1).trim()));
        } catch (NumberFormatException e) {
            throw new InputException("partition table \"" + spec + "\": MOL and ISO must be whole numbers (expected MOL/ISO=FILE, e.g. 19/1=q.txt)");
        }
    }
}

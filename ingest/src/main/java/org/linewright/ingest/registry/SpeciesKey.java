package org.linewright.ingest.registry;

/**
 * An isotopologue as one {@code long} — molecule number in the high 32 bits, isotopologue number in the low 32 —
 * for maps and sets keyed by species without an object per line. The one encoding; every such key in the code is
 * made and taken apart here.
 */
public final class SpeciesKey {
    private SpeciesKey() {
    }

    /** The key of isotopologue {@code isotopologue} of molecule {@code moleculeId}. */
    public static long of(int moleculeId, int isotopologue) {
        return ((long) moleculeId << 32) | (isotopologue & 0xffffffffL);
    }

    /** The molecule number of a key. */
    public static int molecule(long key) {
        return (int) (key >>> 32);
    }

    /** The isotopologue number of a key. */
    public static int isotopologue(long key) {
        return (int) key;
    }

    /** {@code molecule/isotopologue}, as species are written in messages and metadata. */
    public static String label(long key) {
        return molecule(key) + "/" + isotopologue(key);
    }
}

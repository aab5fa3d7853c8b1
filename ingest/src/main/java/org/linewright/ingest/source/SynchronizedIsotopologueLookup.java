package org.linewright.ingest.source;

import java.util.List;

/**
 * An {@link IsotopologueLookup} whose every call holds one lock, for lookups that are not thread-safe (a registry
 * with stored partition functions, a catalog's table) shared by worker threads. Callers that ask often keep
 * their own per-thread cache; this only makes the shared source safe.
 */
public final class SynchronizedIsotopologueLookup implements IsotopologueLookup {
    private final IsotopologueLookup delegate;

    /** A view of {@code delegate} in which every call is serialized. */
    public static IsotopologueLookup of(IsotopologueLookup delegate) {
        return delegate instanceof SynchronizedIsotopologueLookup ? delegate : new SynchronizedIsotopologueLookup(delegate);
    }

    private SynchronizedIsotopologueLookup(IsotopologueLookup delegate) {
        this.delegate = delegate;
    }

    @Override
    public synchronized Id byIsotopeFormula(String isotopeFormula) {
        return delegate.byIsotopeFormula(isotopeFormula);
    }

    @Override
    public synchronized Id byCatalogTag(int speciesTag) {
        return delegate.byCatalogTag(speciesTag);
    }

    @Override
    public synchronized boolean isKnown(int moleculeId, int isotopologue) {
        return delegate.isKnown(moleculeId, isotopologue);
    }

    @Override
    public synchronized double massGPerMol(int moleculeId, int isotopologue) {
        return delegate.massGPerMol(moleculeId, isotopologue);
    }

    @Override
    public synchronized double naturalAbundance(int moleculeId, int isotopologue) {
        return delegate.naturalAbundance(moleculeId, isotopologue);
    }

    @Override
    public synchronized double partitionSum(int moleculeId, int isotopologue, double temperatureK) {
        return delegate.partitionSum(moleculeId, isotopologue, temperatureK);
    }

    @Override
    public synchronized String partitionSumSource(int moleculeId, int isotopologue, double temperatureK) {
        return delegate.partitionSumSource(moleculeId, isotopologue, temperatureK);
    }

    @Override
    public synchronized List<String> partitionSumWarnings(int moleculeId, int isotopologue,
                                                          double temperatureK) {
        return delegate.partitionSumWarnings(moleculeId, isotopologue, temperatureK);
    }
}

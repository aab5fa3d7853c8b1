package org.linewright.ingest.registry;

/**
 * A molecule of the registry.
 *
 * @param id the molecule number (the numbering of the 160-character line-list format, common practice)
 * @param formula the chemical formula, e.g. {@code CO2}
 * @param name the common name, e.g. {@code carbon dioxide}
 */
public record Molecule(int id, String formula, String name) { }

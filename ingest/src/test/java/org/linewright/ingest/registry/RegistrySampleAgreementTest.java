package org.linewright.ingest.registry;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.IOException;
import java.util.ArrayList;
import java.util.Collections;
import java.util.List;
import java.util.Map;
import java.util.TreeMap;
import org.junit.jupiter.api.Test;
import org.linewright.ingest.testsupport.ReferenceSamples;

/**
 * The registry's Q(296 K)/abundance of the isotopologues in the real HITRAN2020 record samples
 * (../shared/reference-data/hitran2020-samples, Gordon et al., JQSRT 277 (2022) 107949) agree with what the
 * records imply, to the rounding of the records. Implied per record, from the 160-character fields (written
 * out here, independently of the readers): Q/Iₐ = A·g′/(8πcν²)·e^(−c2E″/T)·(1−e^(−c2ν/T))/S at T = 296 K
 * (Šimečková et al., JQSRT 98 (2006) 130); the median over each isotopologue's records.
 */
class RegistrySampleAgreementTest {
    private static final double C2 = 1.438776877; // cm K, CODATA 2018
    private static final double C = 2.99792458e10; // cm/s, exact

    @Test
    void sampleIsotopologuesAgreeToTheRoundingOfTheRecords() throws IOException {
        MoleculeRegistry registry = MoleculeRegistry.builtIn();
        int checked = 0;
        for (String file : new String[] {"sample_CO.par", "sample_CO2.par", "sample_N2O.par", "sample_PH3.par"}) {
            Map<String, List<Double>> implied = new TreeMap<>();
            for (String r : ReferenceSamples.lines(ReferenceSamples.hitranSample(file))) {
                if (r.length() < 160) {
                    continue;
                }
                int mol = Integer.parseInt(r.substring(0, 2).trim());
                char isoChar = r.charAt(2);
                int iso = isoChar == '0' ? 10 : isoChar - '0';
                double nu = Double.parseDouble(r.substring(3, 15));
                double s = Double.parseDouble(r.substring(15, 25));
                double a = Double.parseDouble(r.substring(25, 35));
                double e = Double.parseDouble(r.substring(45, 55));
                double g = Double.parseDouble(r.substring(146, 153));
                double q = a * g / (8 * Math.PI * C * nu * nu) * Math.exp(-C2 * e / 296.0)
                        * -Math.expm1(-C2 * nu / 296.0) / s;
                implied.computeIfAbsent(mol + "/" + iso, k -> new ArrayList<>()).add(q);
            }
            for (Map.Entry<String, List<Double>> en : implied.entrySet()) {
                List<Double> v = en.getValue();
                Collections.sort(v);
                double median = v.get(v.size() / 2);
                Isotopologue iso = registry.isotopologue(en.getKey());
                double registryValue = iso.q296() / iso.abundance();
                // S and A have 4 significant digits (±5e-4 each at most); a median of many records is far better.
                double tolerance = v.size() >= 10 ? 5e-4 : 1e-3;
                assertEquals(1.0, registryValue / median, tolerance, en.getKey() + " (" + v.size() + " records)");
                assertTrue(iso.provenance().contains("sample"), en.getKey() + " provenance: " + iso.provenance());
                checked++;
            }
        }
        assertEquals(20, checked);
    }

    @Test
    void everyRowNamesItsPublishedSource() {
        for (Isotopologue iso : MoleculeRegistry.builtIn().isotopologues()) {
            String p = iso.provenance();
            assertTrue(p.contains("abundance") && p.contains("Q(296 K)") && p.contains("mass"), iso.key() + ": " + p);
        }
    }
}

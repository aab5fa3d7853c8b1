package org.linewright.cli;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.IOException;
import java.io.PrintWriter;
import java.io.StringWriter;
import java.nio.file.Files;
import java.nio.file.Path;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.linewright.ingest.testsupport.ReferenceSamples;

/**
 * Old spellings of renamed options (DEVELOPERS.md, "Naming") do for one version exactly what the new ones do, and
 * say so in one note on the command's error stream. Run on the HITRAN2020 CO sample (Gordon et al. 2022, JQSRT 277,
 * 107949; ../shared/reference-data, skipped visibly when absent).
 */
class DeprecatedSpellingsTest {
    @TempDir
    Path tmp;

    private record Run(int code, String out, String err) {
    }

    private static Run run(String... args) {
        StringWriter out = new StringWriter();
        StringWriter err = new StringWriter();
        int code = Main.commandLine(new PrintWriter(out, true), new PrintWriter(err, true)).execute(args);
        return new Run(code, out.toString(), err.toString());
    }

    @Test
    void oldSpellingsGiveTheSameFilesAndOneNoteEach() throws IOException {
        Path sample = ReferenceSamples.hitranSample("sample_CO.par");
        Path storeNew = tmp.resolve("store-new");
        Path storeOld = tmp.resolve("store-old");
        Run a = run("ingest", sample.toString(), "--store", storeNew.toString(), "--input-format", "hitran160", "-q");
        Run b = run("ingest", sample.toString(), "--store", storeOld.toString(), "--format", "hitran160", "-q");
        assertEquals(0, a.code(), a.err());
        assertEquals(0, b.code(), b.err());
        assertEquals("note: --format is deprecated, write --input-format", b.err().strip());
        assertTrue(a.err().isEmpty(), a.err());

        String[] common = {"--temperature", "296", "--pressure", "1atm", "--background", "air=1", "--between",
            "2100", "2140", "--step", "0.01", "--cutoff", "5", "--engine", "fast", "-q"};
        Path sigmaNew = tmp.resolve("new.csv");
        Path sigmaOld = tmp.resolve("old.csv");
        Run s1 = run(concat(new String[] {"sigma", storeNew.toString(), "--out", sigmaNew.toString(),
            "--max-relative-error", "1e-4", "--threshold-cm-per-molecule", "1e-25", "--cutoff-hwhm-multiple", "500"},
                common));
        Run s2 = run(concat(new String[] {"sigma", storeNew.toString(), "--out", sigmaOld.toString(),
            "--tolerance", "1e-4", "--threshold", "1e-25", "--cutoff-hwhm", "500"}, common));
        assertEquals(0, s1.code(), s1.err());
        assertEquals(0, s2.code(), s2.err());
        assertArrayEquals(Files.readAllBytes(sigmaNew), Files.readAllBytes(sigmaOld));
        for (String n : new String[] {"--tolerance is deprecated, write --max-relative-error",
            "--threshold is deprecated, write --threshold-cm-per-molecule",
            "--cutoff-hwhm is deprecated, write --cutoff-hwhm-multiple"}) {
            assertTrue(s2.err().contains("note: " + n), s2.err());
        }
        assertEquals(3, s2.err().strip().split("\\R").length, s2.err());

        Run v1 = run("verify", storeNew.toString(), "--report-format", "json");
        Run v2 = run("verify", storeNew.toString(), "--format", "json");
        assertEquals(v1.code(), v2.code(), v2.err());
        assertEquals(v1.out(), v2.out());
        assertTrue(v2.err().contains("note: --format is deprecated, write --report-format"), v2.err());
    }

    private static String[] concat(String[] a, String[] b) {
        String[] r = java.util.Arrays.copyOf(a, a.length + b.length);
        System.arraycopy(b, 0, r, a.length, b.length);
        return r;
    }
}

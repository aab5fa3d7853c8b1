package org.linewright.grid.hdf5;

import static org.junit.jupiter.api.Assertions.assertEquals;

import java.nio.charset.StandardCharsets;
import org.junit.jupiter.api.Test;

class Lookup3Test {
    @Test
    void matchesTheReferenceImplementationsSelfTestValues() {
        // Values printed by the driver of Bob Jenkins' lookup3.c (driver5, hashlittle with initval 0; from memory):
        // the empty string hashes to 0xdeadbeef, "Four score and seven years ago" to 0x17770551.
        assertEquals(0xdeadbeef, Lookup3.hash(new byte[0], 0, 0));
        byte[] text = "Four score and seven years ago".getBytes(StandardCharsets.US_ASCII);
        assertEquals(0x17770551, Lookup3.hash(text, 0, text.length));
    }
}

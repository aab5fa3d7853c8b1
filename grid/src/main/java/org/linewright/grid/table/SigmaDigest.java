package org.linewright.grid.table;

import java.nio.ByteBuffer;
import java.nio.ByteOrder;
import java.security.MessageDigest;
import java.security.NoSuchAlgorithmException;
import java.util.HexFormat;
import org.linewright.grid.plan.TablePlan;

/**
 * The σ checksum of a table: SHA-256 of σ's values as stored (IEEE 754 float32 or float64, little-endian), in
 * the order [pressure][temperature][wavenumber]. Written in the table's metadata ({@code sigma_sha256}) so a
 * reader can check the values it loaded, whatever the file format.
 */
public final class SigmaDigest {
    private final MessageDigest sha256;
    private final TablePlan.Precision precision;
    private final ByteBuffer buffer = ByteBuffer.allocate(8 * 4096).order(ByteOrder.LITTLE_ENDIAN);

    public SigmaDigest(TablePlan.Precision precision) {
        try {
            this.sha256 = MessageDigest.getInstance("SHA-256");
        } catch (NoSuchAlgorithmException e) {
            throw new IllegalStateException("SHA-256 is required of every Java platform", e);
        }
        this.precision = precision;
    }

    /** Adds the next σ row (one (p, T)), rounded to the stored precision. */
    public void update(double[] sigma) {
        for (double v : sigma) {
            if (buffer.remaining() < 8) {
                flush();
            }
            if (precision == TablePlan.Precision.FLOAT32) {
                buffer.putFloat((float) v);
            } else {
                buffer.putDouble(v);
            }
        }
        flush();
    }

    private void flush() {
        buffer.flip();
        sha256.update(buffer);
        buffer.clear();
    }

    /** The hex digest (ends this digest). */
    public String hex() {
        return HexFormat.of().formatHex(sha256.digest());
    }
}

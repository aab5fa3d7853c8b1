package org.linewright.ingest.store;

import java.io.IOException;
import java.nio.channels.WritableByteChannel;
import java.nio.charset.StandardCharsets;
import java.util.LinkedHashMap;
import java.util.Map;
import org.apache.arrow.vector.VectorSchemaRoot;
import org.apache.arrow.vector.ipc.ArrowFileWriter;
import org.apache.arrow.vector.ipc.WriteChannel;
import org.apache.arrow.vector.ipc.message.ArrowFooter;
import org.apache.arrow.vector.ipc.message.MessageSerializer;
import org.apache.arrow.vector.types.pojo.Schema;

/**
 * An Arrow IPC file writer whose footer schema carries metadata completed when the file ends. Some of a store
 * file's metadata (counts, wavenumber range, batch index) is known only after the last line, but the schema at
 * the start of the file is written before the first. IPC file readers take the schema from the footer, so
 * the footer's copy — the starting schema with {@code completion} added — is the file's schema for them.
 *
 * <p>The footer is written as the Arrow IPC file format specifies (and as {@link ArrowFileWriter} does): an end-
 * of-stream marker, the flatbuffer footer, its length, and the magic {@code ARROW1}.
 */
final class CompletedSchemaFileWriter extends ArrowFileWriter {
    private static final byte[] MAGIC = "ARROW1".getBytes(StandardCharsets.US_ASCII);
    private final Map<String, String> completion;

    /**
     * @param completion metadata added to the footer schema; filled by the caller before {@link #end()}
     */
    CompletedSchemaFileWriter(VectorSchemaRoot root, WritableByteChannel out, Map<String, String> completion) {
        super(root, null, out);
        this.completion = completion;
    }

    @Override
    protected void endInternal(WriteChannel out) throws IOException {
        if (!option.write_legacy_ipc_format) {
            out.writeIntLittleEndian(MessageSerializer.IPC_CONTINUATION_TOKEN);
        }
        // End-of-stream marker: a message of length 0.
        out.writeIntLittleEndian(0);
        Map<String, String> metadata = new LinkedHashMap<>(schema.getCustomMetadata());
        metadata.putAll(completion);
        long footerStart = out.getCurrentPosition();
        out.write(new ArrowFooter(new Schema(schema.getFields(), metadata), getDictionaryBlocks(), getRecordBlocks()), false);
        out.writeIntLittleEndian((int) (out.getCurrentPosition() - footerStart));
        out.write(MAGIC);
    }
}

package org.polebench.capture;

import java.util.Arrays;
import java.util.Optional;

/**
 * What came back where a definite-length block was expected: the block's bytes from its
 * {@code #} on, or why it is not one (a line of text, a malformed header). A final class rather
 * than a record because it holds a byte array, copied in and out.
 */
public final class BlockAnswer {
    private final byte[] bytes;
    private final String refusal;

    private BlockAnswer(byte[] bytes, String refusal) {
        this.bytes = bytes;
        this.refusal = refusal;
    }

    static BlockAnswer of(byte[] bytes) {
        return new BlockAnswer(bytes.clone(), null);
    }

    static BlockAnswer refused(String why) {
        return new BlockAnswer(null, why);
    }

    /** @return why the answer is not a block, empty when it is one */
    public Optional<String> refusal() {
        return Optional.ofNullable(refusal);
    }

    /** @return the block, header included; empty for a refusal */
    public byte[] bytes() {
        return bytes == null ? new byte[0] : Arrays.copyOf(bytes, bytes.length);
    }

    /** @return the block's length, header included; 0 for a refusal */
    public int length() {
        return bytes == null ? 0 : bytes.length;
    }
}

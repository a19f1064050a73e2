package org.polebench.capture;

import java.nio.ByteBuffer;
import java.nio.CharBuffer;
import java.nio.charset.CharsetDecoder;
import java.nio.charset.CodingErrorAction;
import java.nio.charset.StandardCharsets;
import java.util.ArrayDeque;
import java.util.Arrays;
import java.util.Optional;
import org.polebench.InputLimits;
import org.polebench.profile.PortSettings;

/**
 * Splits received bytes into lines at the line ending's last character ({@code \n} for LF
 * and CRLF, {@code \r} for CR), dropping a {@code \r} before a {@code \n}, so a device that
 * sends CRLF where LF was configured still reads. Bytes are decoded per line as UTF-8 with
 * replacement, so one bad byte spoils one line only. A line longer than the limit on one line
 * ({@link InputLimits#maxLineChars()}) keeps its first part, ends in "…" so that no pattern
 * takes it for a reading, and the rest is dropped: a device that never sends its line ending
 * cannot fill the memory (issue 15).
 *
 * <p>After {@link #expectBlock} the next answer is read as an IEEE 488.2 definite-length block
 * (IEEE Std 488.2-1992, 8.7.9: {@code #}, a digit n from 1 to 9, n digits giving the byte count
 * L, then L bytes, which may hold the line ending's byte): by its length prefix, never split at
 * line endings, and the line ending after it is dropped. An answer that does not start with a
 * block header is read on as a line and handed out as the block's refusal. Not thread-safe.
 */
final class LineAssembler {
    private final byte terminator;
    private final int maxBytes;
    private final long maxBlockBytes;
    private boolean cut;
    private byte[] partial = new byte[256];
    private int length;
    private final ArrayDeque<String> lines = new ArrayDeque<>();
    private final ArrayDeque<BlockAnswer> blocks = new ArrayDeque<>();
    /** Where a block being read stands. */
    private enum BlockState { NONE, HASH, DIGIT, COUNT, BODY, AFTER }

    private BlockState block = BlockState.NONE;
    private int countDigits;
    private long blockLength;
    private byte[] blockBytes;
    private int blockFill;
    /** true while a line is being read in place of an expected block */
    private boolean refusing;
    private final CharsetDecoder decoder = StandardCharsets.UTF_8.newDecoder()
            .onMalformedInput(CodingErrorAction.REPLACE).onUnmappableCharacter(CodingErrorAction.REPLACE);

    LineAssembler(PortSettings.LineEnding ending) {
        this.terminator = ending == PortSettings.LineEnding.CR ? (byte) '\r' : (byte) '\n';
        this.maxBytes = (int) Math.min(Integer.MAX_VALUE - 8, InputLimits.standing().maxLineChars());
        // two bytes a sample at most, within the limit on samples in one record
        this.maxBlockBytes = Math.min(Integer.MAX_VALUE - 64, 2 * InputLimits.standing().maxSamples());
    }

    /** The next answer is a definite-length block. */
    void expectBlock() {
        block = BlockState.HASH;
        refusing = false;
    }

    /** @return the next block read, or the refusal of one; empty when none is finished */
    Optional<BlockAnswer> nextBlock() {
        BlockAnswer done = blocks.poll();
        if (done != null) {
            return Optional.of(done);
        }
        if (refusing && !lines.isEmpty()) {
            refusing = false;
            return Optional.of(BlockAnswer.refused("the answer is a line, not a block: '" + shortened(lines.poll()) + "'"));
        }
        return Optional.empty();
    }

    /**
     * Gives up waiting for a block (its time is up).
     *
     * @return what had arrived of it, in words; empty when nothing had
     */
    Optional<String> abandonBlock() {
        Optional<String> part;
        if (block == BlockState.BODY) {
            part = Optional.of("the block was cut short: " + (blockFill - (blockBytes.length - blockLength)) + " of "
                    + blockLength + " bytes arrived");
        } else if (block == BlockState.DIGIT || block == BlockState.COUNT) {
            part = Optional.of("the block's header was cut short");
        } else if (refusing) {
            part = Optional.of("the answer is an unfinished line, not a block: '" + shortened(unfinished()) + "'");
        } else {
            part = Optional.empty();
        }
        block = BlockState.NONE;
        blockBytes = null;
        refusing = false;
        return part;
    }

    private static String shortened(String text) {
        return text.length() <= 60 ? text : text.substring(0, 60) + "\u2026";
    }

    /** @return true when the byte belonged to a block (or its header) and is used up */
    private boolean blockByte(byte b) {
        switch (block) {
            case NONE:
                return false;
            case HASH:
                if (b == '#') {
                    block = BlockState.DIGIT;
                    return true;
                }
                if (b == '\r' || b == '\n') {
                    // the line ending of the block before, when it came in a later read than its
                    // block: not an answer, so it is passed over
                    return true;
                }
                block = BlockState.NONE;
                refusing = true;
                return false;
            case DIGIT:
                if (b == '0') {
                    refuse("an indefinite-length block (#0), which is not read; set the scope to definite-length blocks");
                    return true;
                }
                if (b < '1' || b > '9') {
                    refuse("a block header '#' without its digit count 1 to 9");
                    return b == terminator;
                }
                countDigits = b - '0';
                blockLength = 0;
                block = BlockState.COUNT;
                return true;
            case COUNT:
                if (b < '0' || b > '9') {
                    refuse("a block header whose byte count is not digits");
                    return b == terminator;
                }
                blockLength = blockLength * 10 + (b - '0');
                if (--countDigits == 0) {
                    if (blockLength > maxBlockBytes) {
                        refuse("a block of " + blockLength + " bytes, above the limit of " + maxBlockBytes);
                        return true;
                    }
                    String header = "#" + Long.toString(blockLength).length() + blockLength;
                    blockBytes = new byte[(int) (header.length() + blockLength)];
                    for (int k = 0; k < header.length(); k++) {
                        blockBytes[k] = (byte) header.charAt(k);
                    }
                    blockFill = header.length();
                    block = BlockState.BODY;
                    if (blockLength == 0) {
                        finishBlock();
                    }
                }
                return true;
            case BODY:
                blockBytes[blockFill++] = b;
                if (blockFill == blockBytes.length) {
                    finishBlock();
                }
                return true;
            case AFTER:
                if (b == '\r' && terminator == '\n') {
                    return true;
                }
                block = BlockState.NONE;
                return b == terminator;
            default:
                throw new IllegalStateException("no block state " + block);
        }
    }

    private void finishBlock() {
        blocks.add(BlockAnswer.of(blockBytes));
        blockBytes = null;
        block = BlockState.AFTER;
    }

    private void refuse(String why) {
        blocks.add(BlockAnswer.refused("the answer is " + why));
        block = BlockState.NONE;
    }

    void accept(byte[] bytes, int count) {
        for (int i = 0; i < count; i++) {
            byte b = bytes[i];
            if (blockByte(b)) {
                continue;
            }
            if (b == terminator) {
                int end = length;
                if (terminator == '\n' && end > 0 && partial[end - 1] == '\r') {
                    end--;
                }
                lines.add(cut ? decode(end) + "\u2026" : decode(end));
                length = 0;
                cut = false;
            } else if (length >= maxBytes) {
                cut = true;
            } else {
                if (length == partial.length) {
                    partial = Arrays.copyOf(partial, (int) Math.min((long) partial.length * 2, maxBytes));
                }
                partial[length++] = b;
            }
        }
    }

    Optional<String> next() {
        return Optional.ofNullable(lines.poll());
    }

    boolean hasLine() {
        return !lines.isEmpty();
    }

    /** @return the unfinished line, now dropped (the tail of a block cut short, once the line went quiet) */
    String discardUnfinished() {
        String text = decode(length);
        length = 0;
        cut = false;
        return text;
    }

    String unfinished() {
        return decode(length);
    }

    private String decode(int count) {
        try {
            decoder.reset();
            CharBuffer chars = decoder.decode(ByteBuffer.wrap(partial, 0, count));
            return chars.toString();
        } catch (java.nio.charset.CharacterCodingException e) {
            throw new IllegalStateException("a replacing decoder cannot fail", e);
        }
    }
}

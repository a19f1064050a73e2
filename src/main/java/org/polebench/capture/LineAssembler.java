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
 * cannot fill the memory (issue 15). Not thread-safe.
 */
final class LineAssembler {
    private final byte terminator;
    private final int maxBytes;
    private boolean cut;
    private byte[] partial = new byte[256];
    private int length;
    private final ArrayDeque<String> lines = new ArrayDeque<>();
    private final CharsetDecoder decoder = StandardCharsets.UTF_8.newDecoder()
            .onMalformedInput(CodingErrorAction.REPLACE).onUnmappableCharacter(CodingErrorAction.REPLACE);

    LineAssembler(PortSettings.LineEnding ending) {
        this.terminator = ending == PortSettings.LineEnding.CR ? (byte) '\r' : (byte) '\n';
        this.maxBytes = (int) Math.min(Integer.MAX_VALUE - 8, InputLimits.standing().maxLineChars());
    }

    void accept(byte[] bytes, int count) {
        for (int i = 0; i < count; i++) {
            byte b = bytes[i];
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

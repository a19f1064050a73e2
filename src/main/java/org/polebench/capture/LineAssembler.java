package org.polebench.capture;

import java.nio.ByteBuffer;
import java.nio.CharBuffer;
import java.nio.charset.CharsetDecoder;
import java.nio.charset.CodingErrorAction;
import java.nio.charset.StandardCharsets;
import java.util.ArrayDeque;
import java.util.Arrays;
import java.util.Optional;
import org.polebench.profile.PortSettings;

/**
 * Splits received bytes into lines at the line ending's last character ({@code \n} for LF
 * and CRLF, {@code \r} for CR), dropping a {@code \r} before a {@code \n}, so a device that
 * sends CRLF where LF was configured still reads. Bytes are decoded per line as UTF-8 with
 * replacement, so one bad byte spoils one line only. Not thread-safe.
 */
final class LineAssembler {
    private final byte terminator;
    private byte[] partial = new byte[256];
    private int length;
    private final ArrayDeque<String> lines = new ArrayDeque<>();
    private final CharsetDecoder decoder = StandardCharsets.UTF_8.newDecoder()
            .onMalformedInput(CodingErrorAction.REPLACE).onUnmappableCharacter(CodingErrorAction.REPLACE);

    LineAssembler(PortSettings.LineEnding ending) {
        this.terminator = ending == PortSettings.LineEnding.CR ? (byte) '\r' : (byte) '\n';
    }

    void accept(byte[] bytes, int count) {
        for (int i = 0; i < count; i++) {
            byte b = bytes[i];
            if (b == terminator) {
                int end = length;
                if (terminator == '\n' && end > 0 && partial[end - 1] == '\r') {
                    end--;
                }
                lines.add(decode(end));
                length = 0;
            } else {
                if (length == partial.length) {
                    partial = Arrays.copyOf(partial, partial.length * 2);
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

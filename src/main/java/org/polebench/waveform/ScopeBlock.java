package org.polebench.waveform;

import java.util.Arrays;
import java.util.Locale;
import org.polebench.InputProblem;
import org.polebench.profile.BlockCoding;
import org.polebench.units.StrictNumber;

/**
 * One channel's samples as a scope answers a waveform query: ASCII numbers separated by commas,
 * or an IEEE 488.2 definite-length arbitrary block (IEEE Std 488.2-1992, 8.7.9: {@code #}, one
 * digit n, n digits giving the byte count L, then L bytes) of signed 8- or 16-bit codes, as
 * live scope capture fetches them (capture's scope runner).
 */
public final class ScopeBlock {
    private ScopeBlock() {
    }

    /**
     * @param answer the bytes of the answer, starting at the block's {@code #}
     * @return the codes, in order; a trailing line ending after the block is ignored
     * @throws InputProblem when the header is malformed, the block is shorter than it says, or
     *                      its length is not a whole number of samples
     */
    public static double[] definiteLength(byte[] answer, BlockCoding coding) throws InputProblem {
        if (answer.length < 2 || answer[0] != '#' || answer[1] < '1' || answer[1] > '9') {
            throw new InputProblem(null, 0, "the waveform answer does not start with a definite-length block header"
                    + " ('#' and a digit 1 to 9)", "check the scope's waveform format setting (binary blocks)");
        }
        int digits = answer[1] - '0';
        if (answer.length < 2 + digits) {
            throw new InputProblem(null, 0, "the block header is cut short", "check the connection and the timeout");
        }
        long length = 0;
        for (int i = 0; i < digits; i++) {
            byte b = answer[2 + i];
            if (b < '0' || b > '9') {
                throw new InputProblem(null, 0, "the block header's byte count is not digits", "check the scope's format");
            }
            length = length * 10 + (b - '0');
        }
        int start = 2 + digits;
        if (answer.length - start < length) {
            throw new InputProblem(null, 0, String.format(Locale.ROOT,
                    "the block says %d bytes but %d arrived", length, answer.length - start),
                    "raise the timeout or check the connection");
        }
        if (length % coding.bytesPerSample() != 0) {
            throw new InputProblem(null, 0, "the block's " + length + " bytes are not a whole number of "
                    + coding.bytesPerSample() + "-byte samples", "check the scope's data width setting");
        }
        int n = (int) (length / coding.bytesPerSample());
        double[] codes = new double[n];
        for (int i = 0; i < n; i++) {
            int at = start + i * coding.bytesPerSample();
            switch (coding) {
                case INT8:
                    codes[i] = answer[at];
                    break;
                case INT16_BIG_ENDIAN:
                    codes[i] = (short) (((answer[at] & 0xff) << 8) | (answer[at + 1] & 0xff));
                    break;
                case INT16_LITTLE_ENDIAN:
                    codes[i] = (short) (((answer[at + 1] & 0xff) << 8) | (answer[at] & 0xff));
                    break;
                default:
                    throw new IllegalStateException("no decoding for " + coding);
            }
        }
        return codes;
    }

    /**
     * @param answer ASCII numbers separated by commas (blanks around them allowed)
     * @throws InputProblem naming the first value that is not a number
     */
    public static double[] ascii(String answer) throws InputProblem {
        String text = answer.strip();
        double[] values = new double[Math.max(16, text.length() / 8)];
        int count = 0;
        int from = 0;
        while (from <= text.length()) {
            int comma = text.indexOf(',', from);
            int to = comma < 0 ? text.length() : comma;
            double value = StrictNumber.parse(text, from, to, false);
            if (!Double.isFinite(value)) {
                throw new InputProblem(null, 0, "value " + (count + 1) + " of the waveform answer ('"
                        + text.substring(from, Math.min(to, from + 20)).strip() + "') is not a number",
                        "check the scope's waveform format setting (ASCII values separated by commas)");
            }
            if (count == values.length) {
                values = Arrays.copyOf(values, count * 2);
            }
            values[count++] = value;
            if (comma < 0) {
                break;
            }
            from = comma + 1;
        }
        return Arrays.copyOf(values, count);
    }
}

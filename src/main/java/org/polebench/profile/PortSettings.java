package org.polebench.profile;

import java.util.Locale;
import java.util.Optional;

/**
 * Serial line settings of one instrument.
 *
 * @param baud       bits per second
 * @param dataBits   5 to 8
 * @param parity     parity bit
 * @param stopBits   1, 1.5 or 2
 * @param lineEnding what ends each command and each answer
 */
public record PortSettings(int baud, int dataBits, Parity parity, double stopBits, LineEnding lineEnding) {
    public PortSettings {
        if (baud <= 0) {
            throw new IllegalArgumentException("baud must be positive");
        }
        if (dataBits < 5 || dataBits > 8) {
            throw new IllegalArgumentException("data bits must be 5 to 8");
        }
        if (stopBits != 1 && stopBits != 1.5 && stopBits != 2) {
            throw new IllegalArgumentException("stop bits must be 1, 1.5 or 2");
        }
    }

    public enum Parity {
        NONE, EVEN, ODD, MARK, SPACE;

        public static Optional<Parity> parse(String text) {
            try {
                return Optional.of(valueOf(text.strip().toUpperCase(Locale.ROOT)));
            } catch (IllegalArgumentException e) {
                return Optional.empty();
            }
        }
    }

    public enum LineEnding {
        LF("\n"), CRLF("\r\n"), CR("\r");

        private final String text;

        LineEnding(String text) {
            this.text = text;
        }

        /** @return the characters sent after each command */
        public String text() {
            return text;
        }

        public static Optional<LineEnding> parse(String text) {
            try {
                return Optional.of(valueOf(text.strip().toUpperCase(Locale.ROOT)));
            } catch (IllegalArgumentException e) {
                return Optional.empty();
            }
        }
    }
}

package org.polebench.profile;

import java.util.Locale;
import java.util.Optional;

/**
 * How the bytes of an IEEE 488.2 definite-length block hold a scope's sample codes: signed
 * integers of one or two bytes (IEEE Std 488.2-1992, 8.7.9 leaves the bytes' meaning to the
 * device; these are the common choices).
 */
public enum BlockCoding {
    /** One signed byte a sample, codes −128 to 127. */
    INT8(1),
    /** Two bytes a sample, most significant first, codes −32768 to 32767. */
    INT16_BIG_ENDIAN(2),
    /** Two bytes a sample, least significant first. */
    INT16_LITTLE_ENDIAN(2);

    private final int bytes;

    BlockCoding(int bytes) {
        this.bytes = bytes;
    }

    public int bytesPerSample() {
        return bytes;
    }

    /** @return the lowest code, the converter's low rail */
    public double lowestCode() {
        return bytes == 1 ? Byte.MIN_VALUE : Short.MIN_VALUE;
    }

    /** @return the highest code, the converter's high rail */
    public double highestCode() {
        return bytes == 1 ? Byte.MAX_VALUE : Short.MAX_VALUE;
    }

    /** @return the profile's spelling, such as {@code int16-big-endian} */
    public String word() {
        return name().toLowerCase(Locale.ROOT).replace('_', '-');
    }

    public static Optional<BlockCoding> parse(String text) {
        for (BlockCoding coding : values()) {
            if (coding.word().equals(text.strip().toLowerCase(Locale.ROOT))) {
                return Optional.of(coding);
            }
        }
        return Optional.empty();
    }
}

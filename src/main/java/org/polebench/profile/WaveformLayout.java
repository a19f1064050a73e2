package org.polebench.profile;

import java.util.List;

/**
 * The text layout of one waveform record.
 *
 * @param delimiter       what separates the cells of a sample row
 * @param decimalComma    true when numbers use a comma as the decimal mark
 * @param headerLines     how many lines at the top of a record, comment and blank lines not
 *                        counted, are header (searched for the sample interval, the frequency
 *                        and the profile's signature)
 * @param commentPrefixes lines starting with one of these (and blank lines) are skipped
 *                        wherever they are; before the samples their text is searched as the
 *                        header's is
 * @param files           the glob that picks a folder's record files, such as {@code *.csv}
 */
public record WaveformLayout(Delimiter delimiter, boolean decimalComma, int headerLines, List<String> commentPrefixes,
                             String files) {
    public WaveformLayout {
        commentPrefixes = List.copyOf(commentPrefixes);
        if (headerLines < 0) {
            throw new IllegalArgumentException("header lines must not be negative, was " + headerLines);
        }
        if (decimalComma && delimiter == Delimiter.COMMA) {
            throw new IllegalArgumentException("a comma cannot be both the delimiter and the decimal mark");
        }
    }
}

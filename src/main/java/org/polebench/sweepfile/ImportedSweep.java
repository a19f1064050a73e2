package org.polebench.sweepfile;

import java.util.List;
import org.polebench.InputWarning;
import org.polebench.sweep.Sweep;

/**
 * A sweep as read from a file, with how it was read.
 *
 * @param sweep       the points, ascending in frequency, and their provenance
 * @param profileName the profile used ({@code auto} when sniffed, with the mapping saying what it found)
 * @param mapping     human-readable column or protocol mapping, such as
 *                    "frequency = column 1 'Freq (kHz)' in kHz; gain = column 2 'Gain (dB)' in dB; …"
 * @param warnings    every warning, each naming file and line where one line is concerned
 */
public record ImportedSweep(Sweep sweep, String profileName, String mapping, List<InputWarning> warnings) {
    public ImportedSweep {
        warnings = List.copyOf(warnings);
    }
}

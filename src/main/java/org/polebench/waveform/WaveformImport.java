package org.polebench.waveform;

import java.util.List;
import org.polebench.InputWarning;
import org.polebench.sweep.Sweep;

/**
 * A set of waveform records read as a sweep, with how it was read.
 *
 * @param sweep    one point per record that could be fitted, ascending in frequency, with the
 *                 fits' uncertainties as the points' own
 * @param mapping  human-readable: the profile's layout and how the records were fitted
 * @param warnings each record's checks and every record dropped, with its reason
 * @param records  how many record files were read, dropped ones included
 */
public record WaveformImport(Sweep sweep, String mapping, List<InputWarning> warnings, int records) {
    public WaveformImport {
        warnings = List.copyOf(warnings);
    }
}

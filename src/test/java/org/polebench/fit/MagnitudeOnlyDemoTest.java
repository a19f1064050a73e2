package org.polebench.fit;

import static org.junit.jupiter.api.Assertions.assertEquals;

import java.nio.file.Path;
import org.junit.jupiter.api.Test;
import org.polebench.InputProblem;
import org.polebench.profile.ProfileLibrary;
import org.polebench.sweep.Sweep;
import org.polebench.sweepfile.SweepReader;

/**
 * Issue 14: the user guide's magnitude-only example must measure the right midband and corner.
 * The file is the demo closed form (DemoSweeps: K = 10, poles at 3 Hz and 0.8 Hz, two zeros at
 * DC, a high-band pole at 80 kHz), printed as an instrument prints it. Its lower −3 dB corner,
 * solved by hand from |H|² = f⁴/((f² + 9)(f² + 0.64)) = ½, is f² = (9.64 + √(9.64² + 4·5.76))/2,
 * f = 3.1945 Hz (the 80 kHz pole moves it by 1e-9). Before, a pole–zero pair far above the band
 * won on BIC and left the midband at 2.19 dB ± 29 dB.
 */
class MagnitudeOnlyDemoTest {
    @Test
    void theMagnitudeOnlySampleGivesTwentyDecibelsAndItsClosedFormCorner() throws InputProblem {
        Sweep sweep = new SweepReader(ProfileLibrary.bundled())
                .read(Path.of("sample-measurements", "imports", "magnitude-only.txt"), "magnitude-only").sweep();
        FitResult fit = new SweepFitter(FitSettings.defaults()).fit(sweep);
        Estimate midband = fit.midbandGainDb();
        Estimate corner = fit.lowerCornerModelHz().orElseThrow();
        double cornerHz = Math.sqrt((9.64 + Math.sqrt(9.64 * 9.64 + 4 * 5.76)) / 2);
        // within the expanded uncertainty of each (the file rounds gains to 0.001 dB)
        assertEquals(20, midband.value(), midband.expandedUncertainty(), midband.toString());
        assertEquals(cornerHz, corner.value(), corner.expandedUncertainty(), corner.toString());
    }
}

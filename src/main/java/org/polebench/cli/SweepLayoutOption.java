package org.polebench.cli;

import java.nio.file.Path;
import org.polebench.InputProblem;
import org.polebench.sweepfile.ImportedSweep;
import org.polebench.profile.ProfileLibrary;
import org.polebench.sweepfile.SweepReader;
import picocli.CommandLine.Option;

/**
 * The {@code --profile} option of every command that reads a sweep file (a picocli mixin), and
 * the reading itself with the bundled profiles plus those in {@code ./instrument-profiles/}.
 */
final class SweepLayoutOption {
    @Option(names = "--profile", paramLabel = "P", defaultValue = SweepReader.AUTO,
            description = "profile name, path of a .yaml profile, or auto (default: sniff the layout)")
    String profile;

    /** @return true when the user left the layout to the sniffer */
    boolean isAuto() {
        return profile.equals(SweepReader.AUTO);
    }

    ImportedSweep read(Path sweepFile) throws InputProblem {
        return read(sweepFile, profile);
    }

    /** Reads with another profile than the option's (a bundled file whose layout is known). */
    ImportedSweep read(Path sweepFile, String profileName) throws InputProblem {
        return new SweepReader(profiles()).read(sweepFile, profileName);
    }

    /** The bundled profiles plus the user's own in {@code ./instrument-profiles/}. */
    static ProfileLibrary profiles() throws InputProblem {
        return ProfileLibrary.standard(Path.of(""));
    }
}

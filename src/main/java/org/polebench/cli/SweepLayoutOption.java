package org.polebench.cli;

import java.nio.file.Path;
import java.util.List;
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

    /** Reads one sweep file, or a folder or list of scope waveform records. */
    ImportedSweep read(List<Path> paths) throws InputProblem {
        return new SweepReader(profiles()).read(paths, profile);
    }

    /** @return how the paths are named in output: the one path, or the first and how many more */
    static String label(List<Path> paths) {
        return paths.size() == 1 ? paths.get(0).toString() : paths.get(0) + " and " + (paths.size() - 1) + " more";
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

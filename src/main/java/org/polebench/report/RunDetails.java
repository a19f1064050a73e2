package org.polebench.report;

import java.io.IOException;
import java.nio.file.Path;
import java.util.List;
import java.util.Optional;
import org.polebench.InputWarning;

/**
 * How one reconcile run was made, for the report's traceability (ISO/IEC 17025:2017 7.8.2.1):
 * the files and their digests, the profile, who ran it, and the options that change the result.
 *
 * @param stageFile      the stage file as the user named it
 * @param stageSha256    hex SHA-256 of the stage file's bytes
 * @param sweepFile      the sweep file as the user named it
 * @param profile        the profile name that read the sweep
 * @param importWarnings what the sweep import noticed, as text
 * @param operator       who ran the test ({@code --operator}); empty when not given
 * @param board          the board id given on the command line ({@code --board}); empty to take
 *                       the sweep's own
 * @param samples        boards drawn for the tolerance spread
 * @param seed           the spread's random seed
 */
public record RunDetails(Path stageFile, String stageSha256, Path sweepFile, String profile,
                         List<String> importWarnings, Optional<String> operator, Optional<String> board, int samples,
                         long seed) {
    public RunDetails {
        importWarnings = List.copyOf(importWarnings);
    }

    /**
     * @throws IOException when the stage file cannot be read for its digest
     */
    public static RunDetails of(Path stageFile, Path sweepFile, String profile, List<InputWarning> importWarnings,
                                Optional<String> operator, Optional<String> board, int samples, long seed)
            throws IOException {
        return new RunDetails(stageFile, FileDigest.sha256(stageFile), sweepFile, profile,
                importWarnings.stream().map(InputWarning::describe).toList(), operator, board, samples, seed);
    }

    /** @return the polebench version from the jar's manifest, or "development build" outside a jar */
    public static String polebenchVersion() {
        String version = RunDetails.class.getPackage().getImplementationVersion();
        return version == null ? "development build" : version;
    }
}

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
 * @param identification approver, conditions and instruments as the user gave them (issue 14)
 */
public record RunDetails(Path stageFile, String stageSha256, Path sweepFile, String profile,
                         List<String> importWarnings, Optional<String> operator, Optional<String> board, int samples,
                         long seed, Identification identification) {
    public RunDetails {
        importWarnings = List.copyOf(importWarnings);
    }

    /** @return these details with the given approver, conditions and instruments */
    public RunDetails with(Identification given) {
        return new RunDetails(stageFile, stageSha256, sweepFile, profile, importWarnings, operator, board, samples, seed,
                given);
    }

    /**
     * The details with nothing identified beyond the operator and board ({@link Identification#NONE}).
     *
     * @throws IOException when the stage file cannot be read for its digest
     */
    public static RunDetails of(Path stageFile, Path sweepFile, String profile, List<InputWarning> importWarnings,
                                Optional<String> operator, Optional<String> board, int samples, long seed)
            throws IOException {
        return new RunDetails(stageFile, FileDigest.sha256(stageFile), sweepFile, profile,
                importWarnings.stream().map(InputWarning::describe).toList(), operator, board, samples, seed,
                Identification.NONE);
    }

    /** @return the polebench version from the jar's manifest, or "development build" outside a jar */
    public static String polebenchVersion() {
        String version = RunDetails.class.getPackage().getImplementationVersion();
        return version == null ? "development build" : version;
    }
}

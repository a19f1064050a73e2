package org.polebench.ledger;

import java.nio.file.Path;
import java.util.List;
import java.util.Optional;
import java.util.regex.Pattern;
import org.polebench.profile.ProfileLibrary;
import org.polebench.reconcile.DecisionRule;

/**
 * What {@code polebench batch} was asked to do.
 *
 * @param stageFile    the stage every board is reconciled against
 * @param benchFile    the bench file the sweeps were measured on, if declared
 * @param sweepFiles   the sweep files, folders already expanded ({@link SweepFiles}), in order
 * @param lot          the lot's name
 * @param station      the test station's name, empty when not given
 * @param operator     who ran the tests, empty when not given
 * @param profile      the profile that reads the sweeps ({@code auto} to sniff each file)
 * @param profiles     the profiles to choose from
 * @param boardPattern a pattern whose first group (or whole match) in a file's name is the
 *                     board id, overriding the sweep's own
 * @param rule         the decision rule of every verdict
 * @param toolVersion  the polebench version, as the ledger records it
 * @param threads      how many boards are reconciled at once, at least 1
 */
public record BatchRequest(Path stageFile, Optional<Path> benchFile, List<Path> sweepFiles, String lot, String station,
                           String operator, String profile, ProfileLibrary profiles, Optional<Pattern> boardPattern,
                           DecisionRule rule, String toolVersion, int threads) {
    public BatchRequest {
        sweepFiles = List.copyOf(sweepFiles);
        if (threads < 1) {
            throw new IllegalArgumentException("a batch needs at least one thread, had " + threads);
        }
    }
}

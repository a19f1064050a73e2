package org.polebench.capture;

import java.nio.file.Path;
import java.util.List;
import java.util.Optional;
import java.util.OptionalDouble;

/**
 * What to capture and where to put it.
 *
 * @param plan       the sweep; empty when resuming, which takes the plan on file
 * @param amplitude  generator level in volts of the profile's amplitude kind; empty for the
 *                   profile's own {@code amplitude}
 * @param name       the output name: the capture writes {@code name.sweep.csv} and
 *                   {@code name.transcript.log}
 * @param resume     continue the capture of that name after its last completed point
 * @param board      the board or serial number, for the sweep's provenance
 * @param notes      more provenance notes for a new sweep, such as the bench it was measured on
 */
public record CaptureRequest(Optional<SweepPlan> plan, OptionalDouble amplitude, Path name, boolean resume,
                             Optional<String> board, List<String> notes) {
    /** A request without further notes. */
    public CaptureRequest(Optional<SweepPlan> plan, OptionalDouble amplitude, Path name, boolean resume,
                          Optional<String> board) {
        this(plan, amplitude, name, resume, board, List.of());
    }

    public CaptureRequest {
        notes = List.copyOf(notes);
        if (name.getFileName() == null) {
            throw new IllegalArgumentException("a capture needs an output name");
        }
    }

    /** A new capture of the plan at the profile's own level. */
    public static CaptureRequest of(SweepPlan plan, Path name) {
        return new CaptureRequest(Optional.of(plan), OptionalDouble.empty(), name, false, Optional.empty());
    }

    /** @return {@code name.sweep.csv} */
    public Path sweepFile() {
        return sibling(".sweep.csv");
    }

    /** @return {@code name.transcript.log} */
    public Path transcript() {
        return sibling(".transcript.log");
    }

    private Path sibling(String suffix) {
        Path file = Path.of(name.getFileName().toString() + suffix);
        return name.getParent() == null ? file : name.getParent().resolve(file);
    }
}

package org.polebench.profile;

import java.nio.file.Path;
import java.util.Optional;

/** A profile for an instrument on a serial line: its protocol and how its numbers read. */
public record SerialProfile(String name, String description, LineProtocol protocol, ReadingScale scale,
                            InstrumentAccuracy accuracy, ReadingLimits limits, Optional<Path> source)
        implements InstrumentProfile {
}

package org.polebench.capture;

import java.io.IOException;
import java.util.List;
import java.util.Map;
import org.polebench.profile.LineProtocol;
import org.polebench.profile.PortSettings;
import org.polebench.profile.SerialProfile;

/**
 * What a capture does that depends on how the instrument talks: one runner per
 * {@link LineProtocol}, chosen once through {@link LineProtocol#apply}, so that a new protocol
 * is a new runner and the compiler names every place that needs one. What both share (links,
 * transcript, identification, the sweep file, the reading conversion) is {@link CaptureSession}.
 *
 * <p>A runner holds configuration only (the profile and its protocol); a capture's own state
 * lives in its session, so one runner serves any number of captures.
 */
sealed interface ProtocolRunner permits ScpiRunner, StreamRunner, ScopeRunner {

    static ProtocolRunner of(SerialProfile profile) {
        return profile.protocol().apply(new LineProtocol.Cases<ProtocolRunner>() {
            @Override
            public ProtocolRunner exchange(LineProtocol.ScpiExchange scpi) {
                return new ScpiRunner(profile, scpi);
            }

            @Override
            public ProtocolRunner stream(LineProtocol.StreamedLines stream) {
                return new StreamRunner(profile, stream);
            }

            @Override
            public ProtocolRunner scope(LineProtocol.ScopeFetch scope) {
                return new ScopeRunner(profile, scope);
            }
        });
    }

    /** @return the names the links are keyed by */
    List<String> linkNames();

    /** @return the port settings for the link of that name */
    PortSettings portSettings(String linkName);

    /** @return the link that instrument is on */
    String linkFor(String instrument);

    /** @return the highest level the profile allows, in volts of its amplitude kind */
    double maxAmplitude();

    /** @return the profile's own level, in volts of its amplitude kind */
    double defaultAmplitude();

    /** @return whether every point carries a phase */
    boolean hasPhase();

    /** @return whether each point carries uncertainties of its own (a fitted record's), so the sweep file has their columns */
    default boolean pointUncertainties() {
        return false;
    }

    /** @return the identity query of each instrument that has one, by instrument, in order */
    Map<String, String> identityQueries();

    /** @return how often an unanswered identity query is repeated */
    int identifyRetries();

    /** Measures the points still pending, appending each to the session's sweep. */
    void sweep(CaptureSession session) throws IOException, CaptureHalt;

    /** After a stop that left the port working: leaves the instrument quiet (the generator off). */
    void finishQuietly(CaptureSession session);
}

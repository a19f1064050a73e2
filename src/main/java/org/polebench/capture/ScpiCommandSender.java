package org.polebench.capture;

import java.io.IOException;
import java.util.List;
import org.polebench.profile.ScpiCommand;
import org.polebench.profile.SerialProfile;

/**
 * Renders a profile's SCPI command templates with a frequency and the session's level, and sends
 * the finishing commands: the same for an SCPI exchange and a generator with a scope.
 */
final class ScpiCommandSender {
    private final SerialProfile profile;
    private final double maxAmplitude;

    ScpiCommandSender(SerialProfile profile, double maxAmplitude) {
        this.profile = profile;
        this.maxAmplitude = maxAmplitude;
    }

    /** @param frequencyHz the frequency to put in the template, or NaN where it takes none */
    String render(CaptureSession session, ScpiCommand command, double frequencyHz) {
        // the level was checked against the maximum before anything was sent; this guards the templates
        if (command.template().contains(ScpiCommand.AMPLITUDE) && session.amplitude > maxAmplitude) {
            throw new IllegalStateException("a level above the profile's maximum was about to be sent");
        }
        double raw = Double.isNaN(frequencyHz) ? 0 : profile.scale().rawFrequency(frequencyHz);
        return command.render(raw, session.amplitude);
    }

    /** Sends the finishing commands, as far as the port lets it. */
    void finishQuietly(CaptureSession session, List<ScpiCommand> finish) {
        try {
            for (ScpiCommand command : finish) {
                session.send(command.instrument(), render(session, command, Double.NaN));
            }
        } catch (IOException e) {
            // the port failed as well: the stop message says what was done
        }
    }
}

package org.polebench.capture;

import java.io.IOException;
import java.net.URISyntaxException;
import java.nio.file.Path;
import java.util.List;
import java.util.Map;
import org.polebench.InputProblem;
import org.polebench.circuit.Stage;
import org.polebench.circuit.StageReader;
import org.polebench.profile.ProfileReader;
import org.polebench.profile.SerialProfile;

/** Test fixtures of the capture tests: profiles, the closed-form test stage and its response. */
final class CaptureBench {
    /** The test stage's parts: 600 Ω source, 1 µF coupling capacitor, 10 kΩ load. */
    static final double SOURCE_OHMS = 600;
    static final double LOAD_OHMS = 10_000;
    static final double FARADS = 1e-6;

    private CaptureBench() {
    }

    static Path resource(String name) {
        try {
            return Path.of(CaptureBench.class.getResource("/capture/" + name).toURI());
        } catch (URISyntaxException e) {
            throw new IllegalStateException(e);
        }
    }

    static SerialProfile scpiProfile() throws InputProblem {
        return (SerialProfile) new ProfileReader().read(resource("scpi-test-bench.yaml"));
    }

    static SerialProfile streamingProfile() throws InputProblem {
        return (SerialProfile) new ProfileReader().read(resource("streaming-test-sweeper.yaml"));
    }

    static Stage rcStage() throws InputProblem {
        return new StageReader().read(resource("rc-coupling.stage.yaml")).stage();
    }

    /**
     * First-order high-pass of a series capacitor between source and load:
     * H = RL/(RS+RL) · jωτ/(1 + jωτ), τ = (RS+RL)·C (closed form; any circuits textbook).
     *
     * @return {gain dB, phase degrees} at the frequency
     */
    static double[] highPass(double frequencyHz, double farads) {
        double wt = 2 * Math.PI * frequencyHz * (SOURCE_OHMS + LOAD_OHMS) * farads;
        double flat = LOAD_OHMS / (SOURCE_OHMS + LOAD_OHMS);
        double magnitude = flat * wt / Math.hypot(1, wt);
        return new double[] {20 * Math.log10(magnitude), Math.toDegrees(Math.atan2(1, wt))};
    }

    /** Both instruments of the SCPI test profile on one line. */
    static Map<String, LineTransport> oneLine(LineTransport line) {
        return Map.of("generator", line, "meter", line);
    }

    /** @return the text of every received line in a transcript, in order */
    static List<String> receivedLines(Path transcript) throws IOException {
        return java.nio.file.Files.readAllLines(transcript).stream()
                .filter(l -> !l.startsWith("#"))
                .filter(l -> l.matches("^\\S+ \\S+ < .*$"))
                .map(l -> l.substring(l.indexOf(" < ") + 3))
                .toList();
    }
}

package org.polebench.capture;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertInstanceOf;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.IOException;
import java.net.InetAddress;
import java.net.ServerSocket;
import java.net.Socket;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.Collections;
import java.util.List;
import java.util.Map;
import java.util.Optional;
import java.util.concurrent.atomic.AtomicBoolean;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.Timeout;
import org.junit.jupiter.api.io.TempDir;
import org.polebench.profile.PortSettings;
import org.polebench.profile.ProfileLibrary;
import org.polebench.profile.ProfileReader;
import org.polebench.profile.SerialProfile;
import org.polebench.sweep.Sweep;
import org.polebench.sweep.SweepPoint;
import org.polebench.sweepfile.SweepReader;

/**
 * The scope runner against a scope written here by hand (no simulator): int8 blocks of two sines
 * of known amplitude and phase, the first record cut short once (a sweep reads back with eight points or more).
 */
@Timeout(60)
class ScopeRunnerTest {
    private static final String PROFILE = String.join("\n",
            "kind: serial-scope",
            "name: hand-made-scope",
            "description: a scope written in the test",
            "instruments:",
            "  generator: {port: {baud: 115200}}",
            "  scope: {port: {baud: 115200}}",
            "set-frequency: {to: generator, send: 'FREQ {frequency_nr3}'}",
            "fetch:",
            "  interval: {to: scope, send: 'XINC?'}",
            "  input: {to: scope, send: 'DATA? 1'}",
            "  output: {to: scope, send: 'DATA? 2'}",
            "  format: block",
            "  samples: {unit: codes, volts-per-code: 1 mV}",
            "retries: 1",
            "timeout-ms: 800",
            "amplitude: 1 Vpp",
            "units: {amplitude: Vpp}",
            "");
    private static final int SAMPLES = 200;

    @TempDir
    Path dir;

    /** Answers the profile's queries; its first record is cut short after 80 of 200 bytes. */
    private static void serve(TcpLine line, AtomicBoolean stop, List<String> log) throws IOException {
        double hz = 1000;
        boolean cut = false;
        while (!stop.get()) {
            Optional<String> received = line.receive(50);
            if (received.isEmpty()) {
                continue;
            }
            String text = received.get().strip();
            log.add(text);
            if (text.equals("*IDN?")) {
                line.send("test,hand-made scope,0,0");
            } else if (text.startsWith("FREQ ")) {
                hz = Double.parseDouble(text.substring(5));
            } else if (text.equals("XINC?")) {
                line.send(String.valueOf(4.7 / (hz * SAMPLES)));
            } else if (text.startsWith("DATA? ")) {
                boolean input = text.endsWith("1");
                byte[] block = new byte[5 + SAMPLES + 1];
                System.arraycopy("#3200".getBytes(StandardCharsets.US_ASCII), 0, block, 0, 5);
                for (int k = 0; k < SAMPLES; k++) {
                    double angle = 2 * Math.PI * 4.7 * k / SAMPLES + (input ? 0 : Math.PI / 4);
                    block[5 + k] = (byte) Math.round((input ? 100 : 50) * Math.sin(angle));
                }
                block[block.length - 1] = '\n';
                if (input && !cut) {
                    cut = true;
                    line.sendBytes(java.util.Arrays.copyOf(block, 5 + 80));
                } else {
                    line.sendBytes(block);
                }
            }
        }
    }

    @Test
    void aRecordCutShortIsRepeatedAndTheSinesGiveTheirKnownGainAndPhase() throws Exception {
        Path profileFile = Files.writeString(dir.resolve("hand-made-scope.yaml"), PROFILE, StandardCharsets.UTF_8);
        SerialProfile profile = (SerialProfile) new ProfileReader().read(profileFile);
        List<String> log = Collections.synchronizedList(new ArrayList<>());
        List<String> retries = Collections.synchronizedList(new ArrayList<>());
        AtomicBoolean stop = new AtomicBoolean();
        CaptureOutcome outcome;
        try (ServerSocket server = new ServerSocket(0, 1, InetAddress.getLoopbackAddress())) {
            Thread serving = new Thread(() -> {
                try (Socket socket = server.accept();
                     TcpLine line = TcpLine.accepted(socket, PortSettings.LineEnding.LF)) {
                    serve(line, stop, log);
                } catch (IOException e) {
                    // the capture's outcome says what went wrong
                }
            }, "hand-made scope");
            serving.setDaemon(true);
            serving.start();
            try (TcpLine bench = TcpLine.connect("127.0.0.1", server.getLocalPort(), PortSettings.LineEnding.LF, 5000)) {
                CaptureListener listener = new CaptureListener() {
                    @Override
                    public void retrying(double frequencyHz, String reason, int attempt, int allowed) {
                        retries.add(reason);
                    }
                };
                outcome = new SweepCapture(profile).run(CaptureRequest.of(new SweepPlan(100, 1000, 8),
                        dir.resolve("hand")), Map.of("generator", bench, "scope", bench), listener, () -> false);
            } finally {
                stop.set(true);
            }
            serving.join(5_000);
        }
        CaptureOutcome.Completed done = assertInstanceOf(CaptureOutcome.Completed.class, outcome);
        assertEquals(8, done.points());
        assertEquals(1, retries.size(), retries.toString());
        assertTrue(retries.get(0).contains("80 of 200 bytes"), retries.get(0));
        Sweep sweep = new SweepReader(ProfileLibrary.bundled()).read(done.sweepFile(), "canonical").sweep();
        for (SweepPoint p : sweep.points()) {
            // amplitudes 50 and 100 codes: 20·log10(0.5) = −6.0206 dB, the output leading by 45°
            // (the sines written above); int8 rounding (q/√12 on 200 samples) moves the fitted
            // amplitude of 50 codes by about 1e-3 relative, 0.01 dB, and the phase by about 0.05°
            assertEquals(20 * Math.log10(0.5), p.gainDb(), 0.05, "at " + p.frequencyHz() + " Hz");
            assertEquals(45, p.phaseDeg().getAsDouble(), 0.3, "at " + p.frequencyHz() + " Hz");
        }
    }
}

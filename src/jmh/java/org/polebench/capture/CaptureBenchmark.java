package org.polebench.capture;

import java.io.IOException;
import java.io.InputStream;
import java.net.InetAddress;
import java.net.ServerSocket;
import java.net.Socket;
import java.net.SocketTimeoutException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.Comparator;
import java.util.List;
import java.util.Map;
import java.util.concurrent.TimeUnit;
import java.util.concurrent.atomic.AtomicBoolean;
import java.util.stream.Stream;
import org.openjdk.jmh.annotations.Benchmark;
import org.openjdk.jmh.annotations.BenchmarkMode;
import org.openjdk.jmh.annotations.Fork;
import org.openjdk.jmh.annotations.Level;
import org.openjdk.jmh.annotations.Measurement;
import org.openjdk.jmh.annotations.Mode;
import org.openjdk.jmh.annotations.OutputTimeUnit;
import org.openjdk.jmh.annotations.Param;
import org.openjdk.jmh.annotations.Scope;
import org.openjdk.jmh.annotations.Setup;
import org.openjdk.jmh.annotations.State;
import org.openjdk.jmh.annotations.TearDown;
import org.openjdk.jmh.annotations.Warmup;
import org.polebench.InputProblem;
import org.polebench.circuit.StageReader;
import org.polebench.profile.PortSettings;
import org.polebench.profile.ProfileReader;
import org.polebench.profile.SerialProfile;
import org.polebench.synth.Fault;
import org.polebench.synth.InstrumentSimulator;
import org.polebench.synth.StageBoard;
import org.polebench.synth.SweepNoise;

/**
 * Capture overhead per point beyond the instrument's own settling (issue 7: under 2 ms a
 * point). The simulator, in this JVM on its own thread, plays the demo hydrophone preamp with
 * a SCPI profile of zero settling, so all the time is polebench's: six commands and five
 * answers per point through the link, parsing, the transcript (eleven lines, each handed to
 * the operating system at once) and the point appended to the sweep file. The simulator's
 * own work (three complex MNA solves per point) counts too, so the figure is an upper bound.
 *
 * <p>Each invocation captures a whole sweep of {@code points} points, identification and
 * setup included, to fresh files; the score is the invocation's time over its points. A
 * capture starts by setting aside stale lines (the line must stay quiet for 300 ms) and
 * identifying the instruments, a fixed cost per capture, so the cost of one more point is
 * the slope between the two sweep sizes: (t(1000)·1000 − t(100)·100) / 900.
 * {@code link=tcp} runs over a loopback socket; {@code link=pty} over a socat
 * pseudo-terminal pair (socat must be installed).
 */
@State(Scope.Benchmark)
@BenchmarkMode(Mode.AverageTime)
@OutputTimeUnit(TimeUnit.MILLISECONDS)
@Warmup(iterations = 3, time = 3)
@Measurement(iterations = 5, time = 3)
@Fork(1)
public class CaptureBenchmark {

    private static final String PROFILE = String.join("\n",
            "kind: serial-scpi",
            "name: benchmark-bench",
            "description: zero-settling SCPI generator and meter on one line (benchmark)",
            "instruments:",
            "  generator:",
            "    port: {baud: 115200, data-bits: 8, parity: none, stop-bits: 1, line-ending: lf}",
            "  meter:",
            "    port: {baud: 115200, data-bits: 8, parity: none, stop-bits: 1, line-ending: lf}",
            "setup:",
            "  - {to: generator, send: \"*RST\"}",
            "  - {to: generator, send: \"VOLT {amplitude_nr3}\"}",
            "  - {to: generator, send: \"OUTP ON\"}",
            "step:",
            "  - {to: generator, send: \"FREQ {frequency_nr3}\"}",
            "  - {to: generator, send: \"*OPC?\"}",
            "  - {to: meter, send: \"MEAS:VOLT:AC? (@1)\", role: reads-input-amplitude}",
            "  - {to: meter, send: \"MEAS:VOLT:AC? (@2)\", role: reads-output-amplitude}",
            "  - {to: meter, send: \"MEAS:PHAS? (@2),(@1)\", role: reads-phase}",
            "  - {to: meter, send: \"SYST:ERR?\"}",
            "finish:",
            "  - {to: generator, send: \"OUTP OFF\"}",
            "settle: {periods: 0, min-ms: 0}",
            "error-query: \"SYST:ERR?\"",
            "retries: 2",
            "timeout-ms: 5000",
            "amplitude: 10 mVrms",
            "max-amplitude: 1 Vrms",
            "units: {frequency: Hz, gain: amplitudes, amplitude: Vrms, phase: degrees, phase-sign: lead-positive,",
            "        phase-wrapped: true}",
            "accuracy: {gain: 0.1 dB, phase: 0.5 deg}",
            "");

    @Param({"tcp", "pty"})
    public String link;

    @Param({"100", "1000"})
    public int points;

    private Path directory;
    private SerialProfile profile;
    private InstrumentSimulator simulator;
    private final AtomicBoolean stop = new AtomicBoolean();
    private Thread server;
    private ServerSocket socket;
    private Process socat;
    private SerialLine bench;
    private int run;

    @Setup(Level.Trial)
    public void start() throws Exception {
        directory = Files.createTempDirectory("polebench-capture-bench");
        Path profileFile = directory.resolve("benchmark-bench.yaml");
        Files.writeString(profileFile, PROFILE, StandardCharsets.UTF_8);
        profile = (SerialProfile) new ProfileReader().read(profileFile);
        Path stage = directory.resolve("hydrophone.stage.yaml");
        try (InputStream in = CaptureBenchmark.class.getResourceAsStream(
                "/sample-measurements/hydrophone-preamp-ce.stage.yaml")) {
            Files.copy(in, stage);
        }
        simulator = new InstrumentSimulator(profile,
                StageBoard.asBuilt(new StageReader().read(stage).stage(), List.of(new Fault.CapacitorValue("C3", 47e-6))),
                SweepNoise.BENCH, 1, List.of());
        PortSettings settings = new SweepCapture(profile).portSettings("generator");
        if (link.equals("tcp")) {
            socket = new ServerSocket(0, 4, InetAddress.getLoopbackAddress());
            socket.setSoTimeout(100);
            server = new Thread(this::serveTcp, "simulator");
        } else {
            Path a = directory.resolve("pty-instrument");
            Path b = directory.resolve("pty-bench");
            socat = new ProcessBuilder("socat", "pty,raw,echo=0,link=" + a, "pty,raw,echo=0,link=" + b)
                    .redirectErrorStream(true).redirectOutput(directory.resolve("socat.log").toFile()).start();
            long deadline = System.nanoTime() + TimeUnit.SECONDS.toNanos(10);
            while (!(Files.exists(a) && Files.exists(b))) {
                if (System.nanoTime() > deadline) {
                    throw new IOException("socat made no pseudo-terminals");
                }
                Thread.sleep(20);
            }
            SerialLine instrument = SerialLine.open(a.toString(), settings);
            bench = SerialLine.open(b.toString(), settings);
            InstrumentSimulator.Session session = simulator.session();
            server = new Thread(() -> {
                try {
                    session.serve(instrument, stop::get, sent -> { });
                } catch (IOException e) {
                    throw new java.io.UncheckedIOException(e);
                } finally {
                    instrument.close();
                }
            }, "simulator");
        }
        server.setDaemon(true);
        server.start();
    }

    private void serveTcp() {
        InstrumentSimulator.Session session = simulator.session();
        while (!stop.get()) {
            try (Socket accepted = socket.accept();
                 TcpLine line = TcpLine.accepted(accepted, PortSettings.LineEnding.LF)) {
                session.serve(line, stop::get, sent -> { });
            } catch (SocketTimeoutException e) {
                // poll the stop flag
            } catch (IOException e) {
                if (!stop.get()) {
                    throw new java.io.UncheckedIOException(e);
                }
            }
        }
    }

    /** @return the time of one whole sweep; divide by {@code points} for the time per point */
    @Benchmark
    public int capture() throws IOException, InputProblem {
        CaptureRequest request = CaptureRequest.of(new SweepPlan(2, 200_000, points), directory.resolve("run" + run++));
        CaptureOutcome outcome;
        if (link.equals("tcp")) {
            try (TcpLine line = TcpLine.connect("127.0.0.1", socket.getLocalPort(), PortSettings.LineEnding.LF, 5000)) {
                outcome = new SweepCapture(profile).run(request, Map.of("generator", line, "meter", line),
                        CaptureListener.silent(), () -> false);
            }
        } else {
            outcome = new SweepCapture(profile).run(request, Map.of("generator", bench, "meter", bench),
                    CaptureListener.silent(), () -> false);
        }
        if (!(outcome instanceof CaptureOutcome.Completed) || outcome.points() != points) {
            throw new IllegalStateException("the capture did not complete: " + outcome);
        }
        Files.delete(request.sweepFile());
        Files.delete(request.transcript());
        return outcome.points();
    }

    @TearDown(Level.Trial)
    public void stop() throws Exception {
        stop.set(true);
        server.join(5000);
        if (socket != null) {
            socket.close();
        }
        if (bench != null) {
            bench.close();
        }
        if (socat != null) {
            socat.destroy();
            socat.waitFor(5, TimeUnit.SECONDS);
        }
        try (Stream<Path> files = Files.walk(directory)) {
            files.sorted(Comparator.reverseOrder()).forEach(p -> p.toFile().delete());
        }
    }
}

package org.polebench.cli;

import java.io.IOException;
import java.io.PrintWriter;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.Optional;
import java.util.OptionalDouble;
import java.util.concurrent.Callable;
import java.util.concurrent.CountDownLatch;
import java.util.concurrent.TimeUnit;
import java.util.concurrent.atomic.AtomicBoolean;
import org.polebench.sweep.Provenance;
import org.polebench.InputProblem;
import org.polebench.bench.Bench;
import org.polebench.bench.BenchReader;
import org.polebench.profile.AmplitudeKind;
import org.polebench.capture.CaptureOutcome;
import org.polebench.capture.CaptureRequest;
import org.polebench.profile.InstrumentProfile;
import org.polebench.profile.SerialProfile;
import org.polebench.capture.SweepCapture;
import org.polebench.capture.SweepPlan;
import org.polebench.units.EngineeringValue;
import org.polebench.units.Quantity;
import picocli.CommandLine.Command;
import picocli.CommandLine.Model.CommandSpec;
import picocli.CommandLine.Option;
import picocli.CommandLine.Spec;

/** {@code polebench capture}: a live stepped sweep over a serial port or a raw TCP socket. */
@Command(name = "capture", mixinStandardHelpOptions = true,
        description = {"Captures a sweep live: identifies the instruments, steps the frequency (log spacing), waits "
                + "for settling, reads the measurements and the error queue as the serial profile says, and writes "
                + "NAME.sweep.csv (canonical, point by point) and NAME.transcript.log (every line sent and received, "
                + "as it happens).",
                "A missing or unreadable answer is retried as often as the profile allows; a lost port or Ctrl-C "
                        + "stops cleanly with every completed point on disk, and --resume NAME continues after the "
                        + "last one. A level above the profile's max-amplitude is refused."},
        footer = {"", "Examples:",
                "  polebench capture --port /dev/ttyUSB0 --profile scpi-generator-meter --from 2Hz --to 200kHz "
                        + "--points 61 --amplitude 100mV --out board7",
                "  polebench capture --port generator=/dev/ttyUSB0 --port meter=/dev/ttyUSB1 "
                        + "--profile scpi-generator-meter --resume board7",
                "  polebench capture --tcp 192.168.0.20:5025 --profile scpi-generator-meter --from 2Hz --to 20kHz "
                        + "--points 31 --out board8"})
final class CaptureCommand implements Callable<Integer> {
    /** How long Ctrl-C waits for the capture to stop cleanly (finish commands, files closed). */
    private static final long STOP_GRACE_SECONDS = 15;

    @Spec
    CommandSpec spec;

    @Option(names = "--port", paramLabel = "[NAME=]PATH",
            description = "serial port of the instruments, or of one named instrument (repeatable)")
    List<String> ports = new ArrayList<>();

    @Option(names = "--tcp", paramLabel = "[NAME=]HOST:PORT",
            description = "raw TCP socket of a networked instrument, often port 5025 (repeatable)")
    List<String> tcps = new ArrayList<>();

    @Option(names = "--profile", paramLabel = "P", required = true,
            description = "serial profile: name or path of a .yaml profile")
    String profileName;

    @Option(names = "--from", paramLabel = "FREQ", description = "lowest frequency, such as 2Hz")
    String from;

    @Option(names = "--to", paramLabel = "FREQ", description = "highest frequency, such as 200kHz")
    String to;

    @Option(names = "--points", paramLabel = "N", description = "number of points, log-spaced, ends included")
    Integer points;

    @Option(names = "--amplitude", paramLabel = "LEVEL",
            description = "generator level in the profile's amplitude kind, such as 100mV (default: the profile's)")
    String amplitude;

    @Option(names = "--out", paramLabel = "NAME", description = "writes NAME.sweep.csv and NAME.transcript.log")
    Path out;

    @Option(names = "--resume", paramLabel = "NAME", description = "continue the capture NAME after its last point")
    Path resume;

    @Option(names = "--board", paramLabel = "TEXT", description = "board or serial number, kept in the sweep's provenance")
    String board;

    @Option(names = "--bench", paramLabel = "FILE",
            description = "a bench file (*.bench.yaml) saying how the board is measured, kept in the sweep's"
                    + " provenance (default: the profile's bench: section, if any)")
    Path benchFile;

    @Option(names = "--no-cautions", description = "do not show the bench cautions before a sweep on a real port")
    boolean noCautions;

    @Override
    public Integer call() throws InputProblem, IOException {
        PrintWriter err = spec.commandLine().getErr();
        SerialProfile profile = serialProfile();
        SweepCapture capture = new SweepCapture(profile);
        CaptureRequest request = request(profile, capture);
        if (ports.isEmpty() && tcps.isEmpty()) {
            throw new InputProblem(null, 0, "no port given", "give --port PATH or --tcp HOST:PORT");
        }
        CaptureDisplay display = new CaptureDisplay(spec.commandLine().getOut(), err, System.console() != null);
        try (BenchLinks links = BenchLinks.open(ports, tcps, capture.linkNames(), capture::portSettings,
                profile.protocol().timeoutMs())) {
            for (String line : links.describe()) {
                spec.commandLine().getOut().println(line);
            }
            if (!links.allLocal() && !noCautions) {
                BenchCautions.print(err, request.amplitude().orElse(capture.defaultAmplitude()), capture.maxAmplitude(),
                        profile.scale().amplitudeKind().symbol(), capture.fetchesRecords());
            }
            AtomicBoolean stop = new AtomicBoolean();
            CountDownLatch stopped = new CountDownLatch(1);
            Thread onCtrlC = new Thread(() -> {
                stop.set(true);
                try {
                    stopped.await(STOP_GRACE_SECONDS, TimeUnit.SECONDS);
                } catch (InterruptedException e) {
                    Thread.currentThread().interrupt();
                }
            }, "polebench-stop");
            Runtime.getRuntime().addShutdownHook(onCtrlC);
            try {
                CaptureOutcome outcome = capture.run(request, links.byName(), display, stop::get);
                display.endBar();
                return report(outcome, request);
            } finally {
                stopped.countDown();
                try {
                    Runtime.getRuntime().removeShutdownHook(onCtrlC);
                } catch (IllegalStateException shuttingDown) {
                    // Ctrl-C: the hook is running and waits for the latch released above
                }
            }
        }
    }

    private SerialProfile serialProfile() throws InputProblem {
        InstrumentProfile profile = SweepLayoutOption.profiles().resolve(profileName);
        return profile.asSerial().orElseThrow(() -> new InputProblem(profile.source().orElse(null), 0, "profile '"
                + profile.name() + "' reads table files; capture needs a serial profile",
                "use scpi-generator-meter, streaming-sweeper or a profile of kind serial-scpi or serial-stream"));
    }

    private CaptureRequest request(SerialProfile profile, SweepCapture capture) throws InputProblem {
        if ((out == null) == (resume == null)) {
            throw new InputProblem(null, 0, out == null ? "no output name given" : "both --out and --resume given",
                    "give --out NAME for a new capture, or --resume NAME to continue one");
        }
        Optional<SweepPlan> plan = Optional.empty();
        if (from != null || to != null || points != null) {
            if (from == null || to == null || points == null) {
                throw new InputProblem(null, 0, "a sweep needs --from, --to and --points together",
                        "give all three, such as --from 2Hz --to 200kHz --points 61");
            }
            double fromHz = hertz("--from", from);
            double toHz = hertz("--to", to);
            if (!(toHz > fromHz)) {
                throw new InputProblem(null, 0, "--to " + to + " is not above --from " + from, "swap them");
            }
            if (points < 2 || points > 100_000) {
                throw new InputProblem(null, 0, "--points " + points + " is out of range", "give 2 to 100000 points");
            }
            plan = Optional.of(new SweepPlan(fromHz, toHz, points));
        } else if (resume == null) {
            throw new InputProblem(null, 0, "a new capture needs its band and number of points",
                    "give --from, --to and --points, such as --from 2Hz --to 200kHz --points 61");
        }
        OptionalDouble level = OptionalDouble.empty();
        if (amplitude != null) {
            AmplitudeKind kind = profile.scale().amplitudeKind();
            for (AmplitudeKind other : AmplitudeKind.values()) {
                if (other != kind && amplitude.strip().endsWith(other.symbol())) {
                    throw new InputProblem(null, 0, "--amplitude " + amplitude + " is in " + other.symbol()
                            + ", but the profile's levels are " + kind.symbol(), "give it in " + kind.symbol());
                }
            }
            double volts;
            try {
                volts = EngineeringValue.parse(amplitude, Quantity.VOLTS);
            } catch (IllegalArgumentException e) {
                throw new InputProblem(null, 0, "--amplitude: " + e.getMessage(), "give a level such as 100mV");
            }
            if (volts > capture.maxAmplitude()) {
                throw new InputProblem(profile.source().orElse(null), 0, "--amplitude " + amplitude + " is above the "
                        + "profile's max-amplitude of " + capture.maxAmplitude() + " " + kind.symbol() + "; nothing was sent",
                        "lower the level; polebench never sends more than the profile's maximum (raise it in the "
                                + "profile only if the stage and instruments may safely take it)");
            }
            level = OptionalDouble.of(volts);
        }
        Path name = resume != null ? resume : out;
        Optional<Bench> bench = benchFile != null ? Optional.of(new BenchReader().read(benchFile)) : profile.bench();
        return new CaptureRequest(plan, level, name, resume != null, Optional.ofNullable(board),
                bench.map(b -> List.of(b.provenanceNote())).orElse(List.of()));
    }

    private static double hertz(String option, String text) throws InputProblem {
        try {
            double hz = EngineeringValue.parse(text, Quantity.HERTZ);
            if (!(hz > 0)) {
                throw new IllegalArgumentException("a frequency must be positive");
            }
            return hz;
        } catch (IllegalArgumentException e) {
            throw new InputProblem(null, 0, option + " " + text + ": " + e.getMessage(), "give a frequency such as 2Hz or 200kHz");
        }
    }

    private int report(CaptureOutcome outcome, CaptureRequest request) {
        PrintWriter out = spec.commandLine().getOut();
        PrintWriter err = spec.commandLine().getErr();
        return outcome.match(new CaptureOutcome.Cases<Integer>() {
            @Override
            public Integer completed(CaptureOutcome.Completed done) {
                out.println("sweep:      " + done.sweepFile() + " (" + done.points() + " points"
                        + (done.skipped() > 0 ? ", " + done.skipped() + " left out" : "") + ")");
                out.println("transcript: " + done.transcript());
                out.flush();
                return ExitCodes.OK;
            }

            @Override
            public Integer stopped(CaptureOutcome.Stopped stopped) {
                err.println("polebench: capture stopped: " + Provenance.printable(stopped.message()));
                err.println("polebench: " + stopped.points() + " of " + stopped.total() + " points are in "
                        + stopped.sweepFile() + "; every line is in " + stopped.transcript());
                err.println("polebench: continue with: polebench capture " + linkArguments() + " --profile "
                        + profileName + " --resume " + request.name());
                err.flush();
                return ExitCodes.INSTRUMENT_OR_IO;
            }
        });
    }

    private String linkArguments() {
        List<String> words = new ArrayList<>();
        ports.forEach(p -> words.add("--port " + p));
        tcps.forEach(t -> words.add("--tcp " + t));
        return String.join(" ", words);
    }
}

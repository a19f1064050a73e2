package org.polebench.cli;

import java.io.IOException;
import java.io.PrintWriter;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import java.util.Optional;
import java.util.concurrent.Callable;
import java.util.concurrent.atomic.AtomicBoolean;
import org.polebench.InputProblem;
import org.polebench.bench.Bench;
import org.polebench.bench.BenchReader;
import org.polebench.bench.MeasuringChain;
import org.polebench.circuit.Stage;
import org.polebench.circuit.StageReader;
import org.polebench.synth.Fault;
import org.polebench.synth.FaultText;
import org.polebench.profile.InstrumentProfile;
import org.polebench.synth.InstrumentSimulator;
import org.polebench.synth.SimulatorServer;
import org.polebench.synth.Misbehaviour;
import org.polebench.profile.SerialProfile;
import org.polebench.synth.BoardResponse;
import org.polebench.synth.MeasuredBoard;
import org.polebench.synth.StageBoard;
import org.polebench.capture.SweepCapture;
import org.polebench.synth.SweepNoise;
import org.polebench.synth.ScopeSignal;
import org.polebench.units.EngineeringValue;
import org.polebench.units.Quantity;
import picocli.CommandLine.Command;
import picocli.CommandLine.Model.CommandSpec;
import picocli.CommandLine.Option;
import picocli.CommandLine.Spec;

/** {@code polebench simulate}: plays a profile's instruments measuring a stage, for tests and demos. */
@Command(name = "simulate", mixinStandardHelpOptions = true,
        description = {"Plays the instruments of a serial profile on a port, measuring the stage's exact small-signal "
                + "response with the faults and noise given, so that capture can be tried without a bench. It "
                + "identifies itself as a simulation; its data are invented.",
                "A serial-scope profile's scope serves records of both channels (--scope-samples, --scope-noise, "
                        + "--scope-bits, --scope-clip).",
                "On request it misbehaves: drops an answer, sends garbage, stalls, or closes the port "
                        + "(--misbehave drop@5,garbage@9,stall@12=4s,close@20; N counts frequency commands)."},
        footer = {"", "Examples:",
                "  socat -d -d pty,raw,echo=0,link=/tmp/bench pty,raw,echo=0,link=/tmp/instr &",
                "  polebench simulate --port /tmp/instr --stage sample-measurements/hydrophone-preamp-ce.stage.yaml "
                        + "--fault C3=4.7u --noise 0.05dB,0.5deg",
                "  polebench simulate --tcp 127.0.0.1:5025 --profile scpi-generator-meter --once",
                "  polebench simulate --tcp 127.0.0.1:5025 --profile generator-scope-blocks --fault C3=4.7u "
                        + "--scope-noise 2mV --scope-clip 1.5V --once"})
final class SimulateCommand implements Callable<Integer> {
    @Spec
    CommandSpec spec;

    @Option(names = "--port", paramLabel = "[NAME=]PATH",
            description = "serial port to answer on, for all instruments or one named instrument (repeatable)")
    List<String> ports = new ArrayList<>();

    @Option(names = "--tcp", paramLabel = "[HOST:]PORT",
            description = "listen for raw-socket connections instead (default host 127.0.0.1; port 0 picks a free one)")
    String tcp;

    @Option(names = "--once", description = "with --tcp: serve one connection, then stop")
    boolean once;

    @Option(names = "--stage", paramLabel = "STAGE", description = "the stage file (default: the bundled demo stage)")
    Path stage;

    @Option(names = "--fault", paramLabel = "PART=VALUE",
            description = "how the board differs, as for synthesize: C3=4.7u, RE=22, bias:Q1=0.6, beta:Q1=1.7 or "
                    + "gain=10 (repeatable)")
    List<String> faults = new ArrayList<>();

    @Option(names = "--noise", paramLabel = "GAIN,PHASE", defaultValue = "0dB,0deg",
            description = "Gaussian noise per point, such as 0.05dB,0.5deg (default none)")
    String noise;

    @Option(names = "--seed", paramLabel = "SEED", defaultValue = "1", description = "seed of the noise (default 1)")
    long seed;

    @Option(names = "--profile", paramLabel = "P", defaultValue = "scpi-generator-meter",
            description = "serial profile to play (default ${DEFAULT-VALUE})")
    String profileName;

    @Option(names = "--misbehave", paramLabel = "LIST", split = ",",
            description = "faults of the line: drop@N, garbage@N, stall@N=TIME, close@N")
    List<String> misbehave = new ArrayList<>();

    @Option(names = "--scope-samples", paramLabel = "N", defaultValue = "2000",
            description = "a serial-scope profile's records: samples per channel (default ${DEFAULT-VALUE})")
    int scopeSamples;

    @Option(names = "--scope-noise", paramLabel = "VOLTS", defaultValue = "0",
            description = "white Gaussian noise on every sample, as a standard deviation such as 2mV (default none)")
    String scopeNoise;

    @Option(names = "--scope-bits", paramLabel = "BITS", defaultValue = "0",
            description = "quantise each channel to this many bits over its range (default: the block coding's "
                    + "resolution, six figures in ASCII)")
    int scopeBits;

    @Option(names = "--scope-clip", paramLabel = "VOLTS",
            description = "the channels' input limit: samples beyond ±VOLTS read ±VOLTS (default none)")
    String scopeClip;

    @Option(names = "--bench", paramLabel = "FILE",
            description = "a bench file (*.bench.yaml): measure the board as that bench would (default: the profile's"
                    + " bench: section, if any)")
    Path benchFile;

    @Override
    public Integer call() throws InputProblem, IOException {
        InstrumentProfile found = SweepLayoutOption.profiles().resolve(profileName);
        SerialProfile profile = found.asSerial().orElseThrow(() -> new InputProblem(found.source().orElse(null), 0,
                "profile '" + found.name() + "' is a table layout",
                "simulate a serial profile, such as scpi-generator-meter or streaming-sweeper"));
        if (ports.isEmpty() == (tcp == null)) {
            throw new InputProblem(null, 0, tcp == null ? "no port given" : "both --port and --tcp given",
                    "give --port PATH, or --tcp [HOST:]PORT to listen on");
        }
        List<Misbehaviour> faultsOfLine = new ArrayList<>();
        for (String text : misbehave) {
            faultsOfLine.add(Misbehaviour.parse(text));
        }
        SweepNoise sigma = FaultText.noise(noise);
        Stage designed = new StageReader().read(StageChoice.resolve(null, stage)).stage();
        List<Fault> asBuilt = new ArrayList<>();
        for (String text : faults) {
            asBuilt.add(FaultText.parse(text, designed));
            FaultText.caution(text, designed).ifPresent(c -> spec.commandLine().getErr().println("polebench: warning: " + c));
        }
        Optional<Bench> bench = benchFile != null ? Optional.of(new BenchReader().read(benchFile)) : profile.bench();
        BoardResponse board = bench.isPresent()
                ? MeasuredBoard.asBuilt(designed, asBuilt, MeasuringChain.of(bench.get(), "simulate --bench"))
                : StageBoard.asBuilt(designed, asBuilt);
        InstrumentSimulator simulator;
        try {
            simulator = new InstrumentSimulator(profile, board, sigma, seed, faultsOfLine, scopeSignal());
        } catch (IllegalArgumentException e) {
            throw new InputProblem(profile.source().orElse(null), 0, e.getMessage(),
                    "simulate a profile in the line format of streaming-sweeper, a SCPI profile, or a scope profile "
                            + "with --scope-bits within its block coding");
        }
        PrintWriter out = spec.commandLine().getOut();
        out.println("simulating " + profile.name() + " measuring " + board.describe()
                + ", noise: " + sigma.describe()
                + (faultsOfLine.isEmpty() ? "" : ", misbehaving " + faultsOfLine) + " (invented data)");
        out.flush();
        AtomicBoolean stop = new AtomicBoolean();
        Thread onCtrlC = new Thread(() -> stop.set(true), "polebench-stop");
        Runtime.getRuntime().addShutdownHook(onCtrlC);
        try {
            return tcp != null ? serveTcp(profile, simulator, stop) : serveSerial(profile, simulator, stop);
        } finally {
            try {
                Runtime.getRuntime().removeShutdownHook(onCtrlC);
            } catch (IllegalStateException shuttingDown) {
                // Ctrl-C: the JVM is stopping anyway
            }
        }
    }

    /** @return the scope options as the simulator takes them */
    private ScopeSignal scopeSignal() throws InputProblem {
        double noiseVolts = volts("--scope-noise", scopeNoise, 0);
        double clipVolts = scopeClip == null ? Double.POSITIVE_INFINITY : volts("--scope-clip", scopeClip, 0);
        if (scopeClip != null && !(clipVolts > 0)) {
            throw new InputProblem(null, 0, "--scope-clip " + scopeClip + " is not a positive level",
                    "give the input limit in volts, such as 1.5V");
        }
        try {
            return new ScopeSignal(scopeSamples, ScopeSignal.PLAIN.periods(), noiseVolts, scopeBits, clipVolts);
        } catch (IllegalArgumentException e) {
            throw new InputProblem(null, 0, e.getMessage(), "see polebench simulate --help for the scope options");
        }
    }

    private static double volts(String option, String text, double least) throws InputProblem {
        double value;
        try {
            value = EngineeringValue.parse(text, Quantity.VOLTS);
        } catch (IllegalArgumentException e) {
            throw new InputProblem(null, 0, option + ": " + e.getMessage(), "give volts such as 2mV");
        }
        if (value < least) {
            throw new InputProblem(null, 0, option + " " + text + " is negative", "give zero or more volts");
        }
        return value;
    }

    private int serveSerial(SerialProfile profile, InstrumentSimulator simulator, AtomicBoolean stop)
            throws InputProblem, IOException {
        SweepCapture names = new SweepCapture(profile);
        PrintWriter out = spec.commandLine().getOut();
        try (BenchLinks links = BenchLinks.open(ports, List.of(), names.linkNames(), names::portSettings, 0)) {
            for (String line : links.describe()) {
                out.println("answering " + line);
            }
            out.flush();
            new SimulatorServer(simulator.session()).serveLines(links.byName().values(), stop::get,
                    (line, end) -> said(out, "line " + line + ": " + words(end)));
        }
        return ExitCodes.OK;
    }

    private int serveTcp(SerialProfile profile, InstrumentSimulator simulator, AtomicBoolean stop)
            throws InputProblem, IOException {
        int colon = tcp.lastIndexOf(':');
        String host = colon > 0 ? tcp.substring(0, colon) : "127.0.0.1";
        int port;
        try {
            port = Integer.parseInt(colon >= 0 ? tcp.substring(colon + 1) : tcp);
        } catch (NumberFormatException e) {
            port = -1;
        }
        if (port < 0 || port > 65535) {
            throw new InputProblem(null, 0, "--tcp " + tcp + " has no port number 0 to 65535", "write it as 127.0.0.1:5025");
        }
        SweepCapture names = new SweepCapture(profile);
        PrintWriter out = spec.commandLine().getOut();
        new SimulatorServer(simulator.session()).serveTcp(host, port, once,
                names.portSettings(names.linkNames().get(0)).lineEnding(), stop::get, new SimulatorServer.Listener() {
                    @Override
                    public void listening(String address) {
                        said(out, "listening on " + address);
                    }

                    @Override
                    public void ended(String line, InstrumentSimulator.End end) {
                        said(out, "connection " + line + ": " + words(end));
                    }
                });
        return ExitCodes.OK;
    }

    private static void said(PrintWriter out, String line) {
        out.println(line);
        out.flush();
    }

    /** @return how serving ended, in words: {@code line lost} for {@code LINE_LOST} */
    private static String words(InstrumentSimulator.End end) {
        return end.name().toLowerCase(Locale.ROOT).replace('_', ' ');
    }
}

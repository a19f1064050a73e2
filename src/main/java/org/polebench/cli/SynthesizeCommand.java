package org.polebench.cli;

import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.Optional;
import java.util.concurrent.Callable;
import org.polebench.InputProblem;
import org.polebench.bench.BenchReader;
import org.polebench.bench.MeasuringChain;
import org.polebench.analysis.Prediction;
import org.polebench.spread.StageAnalysis;
import org.polebench.circuit.BiasSolver;
import org.polebench.circuit.SmallSignalExpansion;
import org.polebench.circuit.Stage;
import org.polebench.circuit.StageReader;
import org.polebench.synth.BoardSynthesizer;
import org.polebench.synth.Fault;
import org.polebench.synth.FaultText;
import org.polebench.sweep.Provenance;
import org.polebench.synth.ScopeRecordSynthesizer;
import org.polebench.sweep.Sweep;
import org.polebench.spread.BoardDraw;
import org.polebench.synth.SweepNoise;
import org.polebench.sweepfile.SweepWriter;
import org.polebench.profile.TableProfile;
import org.polebench.units.EngineeringValue;
import org.polebench.units.Quantity;
import picocli.CommandLine.Command;
import picocli.CommandLine.Model.CommandSpec;
import picocli.CommandLine.Option;
import picocli.CommandLine.Spec;

/** {@code polebench synthesize}: an invented sweep of a board built from a stage, with stated faults. */
@Command(name = "synthesize", mixinStandardHelpOptions = true,
        description = {"Writes the sweep a board built from the stage would give: the stage's full small-signal "
                + "response with the stated faults and seeded Gaussian noise, at log-spaced frequencies. "
                + "The file says in its notes that it is invented demo data, with the fault, noise and seed.",
                "A fault is PART=VALUE: C3=4.7u (a capacitor's value), RE=22 or R2=47k (a resistor's value; "
                        + "the bias is solved again for the board as built), bias:Q1=0.6 (a bias current factor), "
                        + "beta:Q1=1.7 (a current gain factor: beta as built over the stage file's; the bias is solved "
                        + "again), gain=10 (a flat gain factor, as a x10 probe read as x1)."},
        footer = {"", "Examples:", "  polebench synthesize --stage s.stage.yaml --fault C3=4.7u --out board.csv",
                "  polebench synthesize --stage s.stage.yaml --fault R2=12k --fault beta:Q1=1.7 --out board.csv",
                "  polebench synthesize --stage s.stage.yaml --fault bias:Q1=0.6 --fault gain=10 --seed 7 --out b.csv",
                "  polebench synthesize --stage s.stage.yaml --draw-seed 12 --board B-012 --seed 12 --out b-012.csv",
                "  polebench synthesize --stage s.stage.yaml --fault C2=1u --waveforms --points 21 --out board-7"})
final class SynthesizeCommand implements Callable<Integer> {
    @Spec
    CommandSpec spec;

    @Option(names = "--stage", paramLabel = "S", required = true, description = "the stage file (*.stage.yaml)")
    Path stageFile;

    @Option(names = "--fault", paramLabel = "F", description = "C3=4.7u, RE=22, bias:Q1=0.6, beta:Q1=1.7 or gain=10; may be repeated")
    List<String> faults = new ArrayList<>();

    @Option(names = "--noise", paramLabel = "N", defaultValue = "0.05dB,0.5deg",
            description = "gain and phase standard deviations (default ${DEFAULT-VALUE})")
    String noise;

    @Option(names = "--seed", paramLabel = "SEED", defaultValue = "1", description = "noise seed (default ${DEFAULT-VALUE})")
    long seed;

    @Option(names = "--points", paramLabel = "N", defaultValue = "61", description = "points (default ${DEFAULT-VALUE})")
    int points;

    @Option(names = "--from", paramLabel = "F", description = "lowest frequency (default: a thirtieth of the exact lower corner)")
    String fromHz;

    @Option(names = "--to", paramLabel = "F", description = "highest frequency (default: 300 times the exact lower corner)")
    String toHz;

    @Option(names = "--layout", paramLabel = "PROFILE", defaultValue = SweepWriter.CANONICAL,
            description = "write in this table profile's layout (default ${DEFAULT-VALUE})")
    String layout;

    @Option(names = "--out", paramLabel = "FILE", required = true,
            description = "the sweep file to write (with --waveforms: the folder for the records)")
    Path out;

    @Option(names = "--waveforms", description = "write scope waveform records instead of a sweep: one file per "
            + "frequency in the folder --out, in the scope-time-volts layout, each channel with Gaussian noise")
    boolean waveforms;

    @Option(names = "--amplitude", paramLabel = "V", defaultValue = "10m",
            description = "with --waveforms: the input sine's peak volts (default ${DEFAULT-VALUE})")
    String amplitude;

    @Option(names = "--record-samples", paramLabel = "N", defaultValue = "2000",
            description = "with --waveforms: samples per record (default ${DEFAULT-VALUE})")
    int recordSamples;

    @Option(names = "--record-periods", paramLabel = "P", defaultValue = "4.7",
            description = "with --waveforms: periods per record (default ${DEFAULT-VALUE})")
    double recordPeriods;

    @Option(names = "--record-noise", paramLabel = "V", defaultValue = "100u",
            description = "with --waveforms: each channel's noise, standard deviation in volts (default ${DEFAULT-VALUE})")
    String recordNoise;

    @Option(names = "--adc-bits", paramLabel = "B", defaultValue = "0",
            description = "with --waveforms: quantise to B bits over +/- --full-scale (default: none)")
    int adcBits;

    @Option(names = "--full-scale", paramLabel = "V",
            description = "with --waveforms: each channel clips at +/- V (default: no clipping)")
    String fullScale;

    @Option(names = "--force", description = "replace an existing output file")
    boolean force;

    @Option(names = "--bench", paramLabel = "FILE",
            description = "a bench file (*.bench.yaml): the sweep as that bench would record it; the notes name it")
    Path benchFile;

    @Option(names = "--draw-seed", paramLabel = "SEED",
            description = "build the board with every resistor, capacitor and beta drawn within its tolerance "
                    + "(uniform in ln, as predict's spread draws), from this seed, before the faults")
    Long drawSeed;

    @Option(names = "--board", paramLabel = "ID", description = "the board's id, written in the file's board line")
    String board;

    @Override
    public Integer call() throws InputProblem, IOException {
        if (Files.exists(out) && !force && !(waveforms && Files.isDirectory(out))) {
            throw new InputProblem(out, 0, "the output file exists already and is kept",
                    "name another file, or add --force to replace it");
        }
        if (points < 2) {
            throw new InputProblem(null, 0, "--points " + points + " is too few for a sweep", "use 2 or more");
        }
        CountLimits.points(points);
        Stage stage = new StageReader().read(stageFile).stage();
        if (drawSeed != null) {
            stage = BoardDraw.draw(stage, drawSeed);
        }
        Optional<MeasuringChain> bench = benchFile == null ? Optional.empty()
                : Optional.of(MeasuringChain.of(new BenchReader().read(benchFile), "synthesize --bench"));
        List<Fault> parsed = new ArrayList<>();
        for (String fault : faults) {
            parsed.add(FaultText.parse(fault, stage));
            FaultText.caution(fault, stage).ifPresent(c -> spec.commandLine().getErr().println("polebench: warning: " + c));
        }
        SweepNoise sweepNoise = FaultText.noise(noise);
        double corner = Double.NaN;
        if (fromHz == null || toHz == null) {
            Prediction prediction = new StageAnalysis().predictNetwork(stage,
                    new SmallSignalExpansion().expand(stage, new BiasSolver().solve(stage)));
            if (prediction.exactLowerCornerHz().isEmpty()) {
                throw new InputProblem(stageFile, 0, "the stage has no lower corner to centre a default band on",
                        "give --from and --to");
            }
            corner = prediction.exactLowerCornerHz().getAsDouble();
        }
        double low = fromHz == null ? corner / 30 : frequency(fromHz, "--from");
        double high = toHz == null ? corner * 300 : frequency(toHz, "--to");
        if (!(high > low)) {
            throw new InputProblem(null, 0, "--to must lie above --from", "swap or widen the band");
        }
        if (waveforms) {
            // the records have their own noise and layout: say so rather than drop the option
            for (String[] pair : new String[][] {{"--noise", "--record-noise"}, {"--layout", "(the scope-time-volts layout)"}}) {
                if (spec.commandLine().getParseResult().hasMatchedOption(pair[0])) {
                    throw new InputProblem(null, 0, pair[0] + " does not apply to --waveforms",
                            "leave it out; the records take " + pair[1] + " instead");
                }
            }
            return writeRecords(stage, parsed, bench, BoardSynthesizer.logSpaced(low, high, points), low, high);
        }
        Sweep sweep = new BoardSynthesizer().synthesize(stage, parsed, sweepNoise,
                BoardSynthesizer.logSpaced(low, high, points), true, seed, bench);
        if (drawSeed != null || board != null) {
            sweep = labelled(sweep);
        }
        SweepWriter writer = new SweepWriter();
        if (layout.equals(SweepWriter.CANONICAL)) {
            writer.writeCanonical(sweep, out, force);
        } else {
            TableProfile profile = SweepLayoutOption.profiles().resolve(layout).asTable()
                    .orElseThrow(() -> new InputProblem(null, 0, "--layout " + layout + " is not a table profile",
                            "name a table profile (polebench profiles lists them)"));
            writer.write(sweep, out, profile, force);
        }
        spec.commandLine().getOut().println("wrote " + out + ": " + points + " points, "
                + EngineeringValue.format(low, "Hz") + " to " + EngineeringValue.format(high, "Hz")
                + " (invented demo data)");
        for (String note : sweep.source().notes()) {
            spec.commandLine().getOut().println("  " + note);
        }
        return ExitCodes.OK;
    }

    /** The sweep with its board id and, for a drawn board, the draw's seed in its notes. */
    private Sweep labelled(Sweep sweep) throws InputProblem {
        if (board != null && (board.isBlank() || board.chars().anyMatch(Character::isISOControl))) {
            throw new InputProblem(null, 0, "--board '" + board + "' is not a board id",
                    "give a name of printable characters, such as HP-012");
        }
        List<String> notes = new ArrayList<>(sweep.source().notes());
        if (drawSeed != null) {
            notes.add("parts drawn within their tolerances (uniform in ln), draw seed: " + drawSeed
                    + ", before the faults");
        }
        Provenance p = sweep.source();
        return new Sweep(new Provenance(p.sourceFile(), p.sha256(), p.instrument(), p.profile(), p.captured(),
                board == null ? p.board() : Optional.of(board), notes), sweep.points(), sweep.calibration());
    }

    private int writeRecords(Stage stage, List<Fault> faults, Optional<MeasuringChain> bench, List<Double> frequencies,
                             double low, double high) throws InputProblem, IOException {
        ScopeRecordSynthesizer.Settings settings;
        try {
            settings = new ScopeRecordSynthesizer.Settings(volts(amplitude, "--amplitude"), recordSamples,
                    recordPeriods, volts(recordNoise, "--record-noise"), adcBits,
                    fullScale == null ? 0 : volts(fullScale, "--full-scale"), seed);
        } catch (IllegalArgumentException e) {
            throw new InputProblem(null, 0, "the record settings are out of range", "use --record-samples of 16 or "
                    + "more, positive --record-periods and --amplitude, --adc-bits up to 24 with a --full-scale");
        }
        String prefix = out.getFileName() == null ? "record" : out.getFileName().toString();
        List<Path> files = new ScopeRecordSynthesizer().write(stage, faults, bench, frequencies, out, prefix, settings,
                force);
        spec.commandLine().getOut().println("wrote " + files.size() + " waveform records to " + out + ", "
                + EngineeringValue.format(low, "Hz") + " to " + EngineeringValue.format(high, "Hz")
                + " (invented demo data)");
        return ExitCodes.OK;
    }

    private static double volts(String text, String option) throws InputProblem {
        try {
            double volts = EngineeringValue.parse(text, Quantity.VOLTS);
            if (volts >= 0 && Double.isFinite(volts)) {
                return volts;
            }
        } catch (IllegalArgumentException e) {
            // refused below with the option named
        }
        throw new InputProblem(null, 0, option + " " + text + " is not a voltage", "write e.g. 0.1 or 2m");
    }

    private static double frequency(String text, String option) throws InputProblem {
        try {
            double hz = EngineeringValue.parse(text, Quantity.HERTZ);
            if (hz > 0) {
                return hz;
            }
        } catch (IllegalArgumentException e) {
            // refused below with the option named
        }
        throw new InputProblem(null, 0, option + " " + text + " is not a positive frequency", "write e.g. 1Hz or 20k");
    }
}

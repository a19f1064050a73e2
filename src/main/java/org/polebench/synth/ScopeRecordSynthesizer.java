package org.polebench.synth;

import java.io.BufferedWriter;
import java.io.IOException;
import java.io.OutputStreamWriter;
import java.math.BigDecimal;
import java.math.MathContext;
import java.nio.charset.StandardCharsets;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import java.util.Optional;
import java.util.SplittableRandom;
import org.apache.commons.math3.complex.Complex;
import org.polebench.InputProblem;
import org.polebench.OutputFile;
import org.polebench.bench.MeasuringChain;
import org.polebench.circuit.Stage;

/**
 * Invented scope records of a board: for each frequency, the input (the generator's sine) and
 * the output (that sine through the board's response) sampled against time, with seeded Gaussian
 * noise on each channel and, on request, an ADC's quantisation and a channel's clipping. Written
 * in the layout of the shipped {@code scope-time-volts} profile, one file per frequency named
 * {@code <prefix>-<frequency>Hz.csv}, each saying in its comments that it is invented demo data.
 */
public final class ScopeRecordSynthesizer {
    /**
     * How the records are made.
     *
     * @param inputVolts  the input sine's peak amplitude
     * @param samples     samples per record
     * @param periods     periods per record (a non-whole number, as a scope's timebase gives)
     * @param noiseVolts  the Gaussian noise's standard deviation on each channel
     * @param bits        the ADC's resolution over ± fullScaleVolts; 0 for none
     * @param fullScaleVolts a channel clips beyond ± this; 0 for no clipping
     * @param seed        the noise and start-phase seed
     */
    public record Settings(double inputVolts, int samples, double periods, double noiseVolts, int bits,
                           double fullScaleVolts, long seed) {
        public Settings {
            if (!(inputVolts > 0) || samples < 16 || !(periods > 0) || !(noiseVolts >= 0) || bits < 0 || bits > 24
                    || !(fullScaleVolts >= 0) || (bits > 0 && fullScaleVolts == 0)) {
                throw new IllegalArgumentException("record settings out of range");
            }
        }
    }

    /**
     * The records of a board built from the stage with the faults, seen through the bench when
     * one is given; each record's comments name the stage, the faults and the seed.
     */
    public List<Path> write(Stage stage, List<Fault> faults, Optional<MeasuringChain> bench, List<Double> frequenciesHz,
                            Path folder, String prefix, Settings settings, boolean overwrite)
            throws InputProblem, IOException {
        BoardResponse board = bench.isPresent() ? MeasuredBoard.asBuilt(stage, faults, bench.get())
                : StageBoard.asBuilt(stage, faults);
        List<String> notes = new ArrayList<>();
        notes.add("stage: " + stage.name());
        StringBuilder faultText = new StringBuilder();
        for (Fault fault : faults) {
            faultText.append(faultText.length() == 0 ? "" : "; ").append(fault.describe());
        }
        notes.add("as built (differences from the stage file): "
                + (faults.isEmpty() ? new Fault.None().describe() : faultText));
        notes.add(String.format(Locale.ROOT, "seed: %d", settings.seed()));
        bench.ifPresent(chain -> notes.add(chain.bench().provenanceNote()));
        return write(board, frequenciesHz, folder, prefix, notes, settings, overwrite);
    }

    /**
     * @param board     the board's response, V(out)/V(in) at each frequency
     * @param frequenciesHz the test frequencies
     * @param folder    where the records go (made when missing)
     * @param prefix    each file name's start
     * @param notes     lines for each record's comments (the stage, the faults, the seed)
     * @param overwrite replace existing files (the user's {@code --force})
     * @return the files written, in frequency order
     */
    public List<Path> write(BoardResponse board, List<Double> frequenciesHz, Path folder, String prefix,
                            List<String> notes, Settings settings, boolean overwrite) throws InputProblem, IOException {
        SplittableRandom random = new SplittableRandom(settings.seed());
        List<Path> written = new ArrayList<>();
        for (double requested : frequenciesHz) {
            // the frequency as the file name states it, so a fit at the stated frequency is exact
            String stated = new BigDecimal(requested).round(new MathContext(6)).stripTrailingZeros().toPlainString();
            double frequencyHz = Double.parseDouble(stated);
            Complex h = board.atHz(frequencyHz);
            double interval = settings.periods() / (frequencyHz * settings.samples());
            double startPhase = 2 * Math.PI * random.nextDouble();
            double[] in = new double[settings.samples()];
            double[] out = new double[settings.samples()];
            double omega = 2 * Math.PI * frequencyHz;
            for (int i = 0; i < settings.samples(); i++) {
                double theta = omega * i * interval + startPhase;
                in[i] = channel(settings, settings.inputVolts() * Math.cos(theta), random);
                out[i] = channel(settings, settings.inputVolts() * h.abs() * Math.cos(theta + h.getArgument()), random);
            }
            Path file = folder.resolve(prefix + "-" + stated + "Hz.csv");
            OutputFile.write(file, overwrite, stream -> {
                BufferedWriter text = new BufferedWriter(new OutputStreamWriter(stream, StandardCharsets.UTF_8));
                text.write("# demo data, invented: a scope record synthesized by polebench, not measured\n");
                for (String note : notes) {
                    text.write("# " + note.replace('\n', ' ') + "\n");
                }
                text.write(String.format(Locale.ROOT, "# generator %s Hz, %.4g V peak; noise %.3g V per channel%s%s%n",
                        stated, settings.inputVolts(), settings.noiseVolts(),
                        settings.bits() > 0 ? ", " + settings.bits() + "-bit ADC" : "",
                        settings.fullScaleVolts() > 0 ? String.format(Locale.ROOT, ", full scale ±%.4g V",
                                settings.fullScaleVolts()) : ""));
                text.write("time (s),ch1 (V),ch2 (V)\n");
                StringBuilder row = new StringBuilder(64);
                for (int i = 0; i < in.length; i++) {
                    row.setLength(0);
                    row.append(String.format(Locale.ROOT, "%.9g,%.7g,%.7g", i * interval, in[i], out[i])).append('\n');
                    text.append(row);
                }
                text.flush();
            });
            written.add(file);
        }
        return written;
    }

    /** Adds noise, then clips and quantises as the scope's channel would. */
    private static double channel(Settings settings, double clean, SplittableRandom random) {
        double value = clean + (settings.noiseVolts() > 0 ? settings.noiseVolts() * random.nextGaussian() : 0);
        double full = settings.fullScaleVolts();
        if (full > 0) {
            value = Math.max(-full, Math.min(full, value));
        }
        if (settings.bits() > 0) {
            double step = 2 * full / (1L << settings.bits());
            value = Math.min(Math.rint(value / step), (1L << (settings.bits() - 1)) - 1) * step;
        }
        return value;
    }
}

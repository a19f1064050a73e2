package org.polebench.bench;

import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.Optional;
import org.polebench.circuit.GainReference;
import org.polebench.circuit.Stage;
import org.polebench.units.EngineeringValue;

/**
 * How a board was measured: the bench file, or a profile's {@code bench:} section
 * (docs/user-guide.md, "The bench file").
 *
 * @param generatorOhms the generator's output resistance in Ω, in series ahead of the stage's
 *                      source resistance; finite, >= 0 (default 0)
 * @param reference     what the gain is taken against; empty when the file does not say, and then
 *                      the stage's own convention applies ({@link #referenceFor})
 * @param output        the output channel ({@link Channel#IDEAL} when the file has none)
 * @param input         the input channel, when the file has one
 * @param sourceFile    the file it was read from (a bench file or a profile); null when built in code
 * @param instruments   the instruments the file lists, for the report only (none in the model)
 */
public record Bench(double generatorOhms, Optional<Reference> reference, Channel output,
                    Optional<InputChannel> input, Path sourceFile, List<BenchInstrument> instruments) {
    /** The bench a stage file assumes: no generator resistance, ideal channels, the stage's own reference. */
    public static final Bench IDEAL = new Bench(0, Optional.empty(), Channel.IDEAL, Optional.empty(), null);

    public Bench {
        if (!(generatorOhms >= 0) || !Double.isFinite(generatorOhms)) {
            throw new IllegalArgumentException("the generator's output resistance must be finite and >= 0, was "
                    + generatorOhms);
        }
        if (reference == null || output == null || input == null) {
            throw new IllegalArgumentException("reference, output and input must not be null");
        }
        instruments = List.copyOf(instruments);
    }

    /** A bench that lists no instruments (built in code, or a file without {@code instruments:}). */
    public Bench(double generatorOhms, Optional<Reference> reference, Channel output, Optional<InputChannel> input,
                 Path sourceFile) {
        this(generatorOhms, reference, output, input, sourceFile, List.of());
    }

    /**
     * @return the reference in force for this stage: the file's, or, when it says none, the
     *         stage's own ({@code reference: node} reads as the input channel at the stage's input)
     */
    public Reference referenceFor(Stage stage) {
        if (reference.isPresent()) {
            return reference.get();
        }
        return stage.input().reference() == GainReference.INPUT_NODE ? Reference.INPUT_CHANNEL : Reference.GENERATOR;
    }

    /**
     * @return the input channel in force: the file's, or an ideal one at the stage's input node
     *         (what a stage file's {@code reference: node} means)
     */
    public InputChannel inputChannel() {
        return input.orElse(new InputChannel(ProbePoint.STAGE_INPUT, Channel.IDEAL));
    }

    /** @return the file it was read from, when there is one */
    public Optional<Path> source() {
        return Optional.ofNullable(sourceFile);
    }

    /** @return the provenance note a sweep measured on this bench carries: {@code bench: FILE: elements} */
    public String provenanceNote() {
        return "bench: " + source().map(f -> f + ": ").orElse("") + describe();
    }

    /** @return true when a channel's AC coupling is given as {@code unknown} */
    public boolean hasUnknownCorner() {
        return output.cornerUnknown() || input.map(i -> i.channel().cornerUnknown()).orElse(false);
    }

    /** @return one line for people and provenance notes: the generator resistance and the reference when given, the channels */
    public String describe() {
        List<String> parts = new ArrayList<>();
        if (generatorOhms > 0) {
            parts.add("generator " + EngineeringValue.format(generatorOhms, "Ω"));
        }
        reference.ifPresent(r -> parts.add("reference " + r.word()));
        parts.add("output channel " + output.describe());
        input.ifPresent(i -> parts.add("input channel " + i.describe()));
        return String.join("; ", parts);
    }
}

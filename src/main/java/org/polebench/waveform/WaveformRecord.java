package org.polebench.waveform;

import java.nio.file.Path;
import java.util.Arrays;
import java.util.OptionalDouble;

/**
 * One scope record: the stage's input and output sampled at an even interval, in volts. A final
 * class rather than a record because it holds two sample arrays that can be 100,000 long: they
 * are copied in, never handed out, and read by index.
 */
public final class WaveformRecord {
    private final Path file;
    private final double startSeconds;
    private final double intervalSeconds;
    private final double[] input;
    private final double[] output;
    private final OptionalDouble statedFrequencyHz;
    private final int firstSampleLine;

    /**
     * @param file              the record's file, named in warnings; may be null for a record made in memory
     * @param startSeconds      the time of the first sample
     * @param intervalSeconds   the sample interval, positive
     * @param input             the input channel in volts
     * @param output            the output channel in volts, as long as the input
     * @param statedFrequencyHz the test frequency the record states (header or file name), when it states one
     * @param firstSampleLine   the file line of the first sample when every sample has its own line in
     *                          order (so sample k is on line first + k − 1); 0 when not
     */
    public WaveformRecord(Path file, double startSeconds, double intervalSeconds, double[] input, double[] output,
                          OptionalDouble statedFrequencyHz, int firstSampleLine) {
        this(file, startSeconds, intervalSeconds, input, output, input.length, statedFrequencyHz, firstSampleLine);
    }

    /** As above, taking the first {@code count} samples of each array. */
    WaveformRecord(Path file, double startSeconds, double intervalSeconds, double[] input, double[] output, int count,
                   OptionalDouble statedFrequencyHz, int firstSampleLine) {
        if (!(intervalSeconds > 0) || !Double.isFinite(intervalSeconds) || !Double.isFinite(startSeconds)) {
            throw new IllegalArgumentException("the sample interval must be positive and finite, was " + intervalSeconds);
        }
        if (count > input.length || count > output.length) {
            throw new IllegalArgumentException("the channels hold fewer than " + count + " samples");
        }
        this.file = file;
        this.startSeconds = startSeconds;
        this.intervalSeconds = intervalSeconds;
        this.input = Arrays.copyOf(input, count);
        this.output = Arrays.copyOf(output, count);
        this.statedFrequencyHz = statedFrequencyHz;
        this.firstSampleLine = Math.max(0, firstSampleLine);
    }

    public Path file() {
        return file;
    }

    public double startSeconds() {
        return startSeconds;
    }

    public double intervalSeconds() {
        return intervalSeconds;
    }

    public int length() {
        return input.length;
    }

    public double input(int index) {
        return input[index];
    }

    public double output(int index) {
        return output[index];
    }

    public OptionalDouble statedFrequencyHz() {
        return statedFrequencyHz;
    }

    /** @return the file line of the 0-based sample, or 0 when samples and lines do not correspond */
    public int lineOf(int index) {
        return firstSampleLine == 0 ? 0 : firstSampleLine + index;
    }

    /** @return the record's duration, samples times interval */
    public double durationSeconds() {
        return input.length * intervalSeconds;
    }

    /** The fits and checks read the samples in place. */
    double[] inputSamples() {
        return input;
    }

    double[] outputSamples() {
        return output;
    }
}

package org.polebench.profile;

/**
 * The columns of a waveform record that hold the two channels.
 *
 * @param input  1-based column of the samples at the stage's input (the gain's reference)
 * @param output 1-based column of the samples at the stage's output
 */
public record WaveformChannels(int input, int output) {
    public WaveformChannels {
        if (input < 1 || output < 1 || input == output) {
            throw new IllegalArgumentException("channel columns must be distinct and 1-based, were " + input + " and "
                    + output);
        }
    }

    /** @return the highest column a sample row must have, the time column aside */
    public int widest() {
        return Math.max(input, output);
    }
}

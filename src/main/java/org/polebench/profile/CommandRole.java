package org.polebench.profile;

import java.util.Locale;
import java.util.Optional;

/** What one command of a SCPI step does, so that a log or a live answer can be read. */
public enum CommandRole {
    /** Sets the test frequency; its {@code {frequency_nr3}} argument starts a new point. */
    SETS_FREQUENCY(false),
    /** Sets the generator level ({@code {amplitude_nr3}}). */
    SETS_AMPLITUDE(false),
    /** A query answered by 1 when the device is done ({@code *OPC?}, IEEE 488.2). */
    WAITS_FOR_COMPLETION(true),
    READS_INPUT_AMPLITUDE(true),
    READS_OUTPUT_AMPLITUDE(true),
    /** Reads the gain as the profile's gain form (dB or ratio). */
    READS_GAIN(true),
    READS_PHASE(true),
    /** Reads one entry of the error queue ({@code SYST:ERR?}, SCPI-99): {@code <code>,"<text>"}. */
    READS_ERROR_QUEUE(true),
    /** Reads the identity ({@code *IDN?}, IEEE 488.2): maker, model, serial, firmware. */
    IDENTIFIES(true),
    /** Anything else: a setting without an answer. */
    SETTING(false);

    private final boolean answered;

    CommandRole(boolean answered) {
        this.answered = answered;
    }

    /** @return true when the instrument answers this command with one line */
    public boolean answered() {
        return answered;
    }

    /** @return the profile's spelling, such as {@code reads-phase} */
    public String word() {
        return name().toLowerCase(Locale.ROOT).replace('_', '-');
    }

    public static Optional<CommandRole> parse(String text) {
        for (CommandRole role : values()) {
            if (role.word().equals(text.strip().toLowerCase(Locale.ROOT))) {
                return Optional.of(role);
            }
        }
        return Optional.empty();
    }
}

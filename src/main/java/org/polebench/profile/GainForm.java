package org.polebench.profile;

import java.util.Optional;

/** How an instrument states the gain of each point. */
public enum GainForm {
    /** 20·log10 |Vout/Vin| in decibels. */
    DB("dB"),
    /** |Vout/Vin| as a plain ratio. */
    RATIO("ratio"),
    /** Two amplitudes, input and output, of one kind (both Vpp, both Vrms or both Vpk). */
    AMPLITUDES("amplitudes");

    private final String word;

    GainForm(String word) {
        this.word = word;
    }

    /** @return the word profiles use: {@code dB}, {@code ratio}, {@code amplitudes} */
    public String word() {
        return word;
    }

    public static Optional<GainForm> parse(String text) {
        return ProfileWords.lookup(values(), GainForm::word, text);
    }
}

package org.polebench.units;

import java.util.List;

/**
 * The physical quantity a value in a stage file or a profile stands for, with the unit
 * symbols a user may write after the number. Symbols are matched exactly (case-sensitive),
 * longest first, so that {@code mF} reads as milli-farad and {@code MHz} as megahertz.
 */
public enum Quantity {
    FARADS("F", List.of("F")),
    OHMS("Ω", List.of("Ω", "ohms", "ohm", "Ohm", "Ohms", "R")),
    HERTZ("Hz", List.of("Hz", "hz", "HZ")),
    VOLTS("V", List.of("Vpp", "Vpk", "Vrms", "V")),
    AMPS("A", List.of("A")),
    SECONDS("s", List.of("s")),
    KELVIN("K", List.of("K")),
    DECIBELS("dB", List.of("dB", "db", "DB")),
    /** MOSFET transconductance parameter k of ID = (k/2)(VGS − Vth)². */
    AMPS_PER_VOLT_SQUARED("A/V²", List.of("A/V²", "A/V^2", "A/V2")),
    /** Per volt, as in the channel-length modulation λ. */
    PER_VOLT("1/V", List.of("1/V", "/V")),
    /** The square root of volts, as in the body-effect coefficient γ. */
    ROOT_VOLTS("√V", List.of("√V", "V^0.5", "sqrt(V)")),
    DIMENSIONLESS("", List.of());

    private final String symbol;
    private final List<String> accepted;

    Quantity(String symbol, List<String> accepted) {
        this.symbol = symbol;
        this.accepted = accepted;
    }

    /** @return the symbol used when printing, such as {@code F} or {@code Ω} */
    public String symbol() {
        return symbol;
    }

    /** @return unit spellings accepted after the number, longest match wins */
    public List<String> acceptedSymbols() {
        return accepted;
    }
}

package org.polebench.capture;

import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import org.polebench.profile.LineProtocol;
import org.polebench.profile.PortSettings;

/**
 * The links of a profile whose instruments each have a link of their own name (an SCPI
 * exchange, a generator with a scope): their names, each one's port settings, and the identity
 * queries of those that have one.
 */
final class InstrumentLinks {
    private final List<LineProtocol.ScpiInstrument> instruments;

    InstrumentLinks(List<LineProtocol.ScpiInstrument> instruments) {
        this.instruments = List.copyOf(instruments);
    }

    List<String> names() {
        List<String> names = new ArrayList<>();
        for (LineProtocol.ScpiInstrument instrument : instruments) {
            names.add(instrument.name());
        }
        return names;
    }

    PortSettings port(String linkName) {
        for (LineProtocol.ScpiInstrument instrument : instruments) {
            if (instrument.name().equals(linkName)) {
                return instrument.port();
            }
        }
        throw new IllegalArgumentException("the profile has no instrument " + linkName);
    }

    /** @return per instrument with an identity query, that query, in profile order */
    Map<String, String> identityQueries() {
        Map<String, String> queries = new LinkedHashMap<>();
        for (LineProtocol.ScpiInstrument instrument : instruments) {
            if (!instrument.identify().isBlank()) {
                queries.put(instrument.name(), instrument.identify());
            }
        }
        return queries;
    }
}

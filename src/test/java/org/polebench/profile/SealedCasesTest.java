package org.polebench.profile;

import static org.junit.jupiter.api.Assertions.assertEquals;

import java.util.ArrayList;
import java.util.List;
import org.junit.jupiter.api.Test;
import org.polebench.SealedCases;

/**
 * The closed sets of the profile package that code tells apart through a {@code Cases} visitor
 * have one case per permitted type, and each type's {@code match} (for a protocol, {@code apply})
 * calls its own (issue 12: a new kind of profile or a new protocol must be found by the
 * compiler, not read by the code of another). The samples are the shipped profiles, which hold
 * table and serial profiles and both protocols.
 */
class SealedCasesTest {

    @SuppressWarnings("unchecked")
    @Test
    void everyKindOfProfileHasItsOwnCase() {
        SealedCases.assertEveryTypeHasItsOwnCase(InstrumentProfile.class, InstrumentProfile.Cases.class,
                ProfileLibrary.bundled().profiles(),
                (profile, cases) -> profile.match((InstrumentProfile.Cases<Object>) cases));
    }

    @SuppressWarnings("unchecked")
    @Test
    void everyProtocolHasItsOwnCase() {
        List<LineProtocol> protocols = new ArrayList<>();
        for (SerialProfile profile : ProfileLibrary.bundled().serialProfiles()) {
            protocols.add(profile.protocol());
        }
        SealedCases.assertEveryTypeHasItsOwnCase(LineProtocol.class, LineProtocol.Cases.class, protocols,
                (protocol, cases) -> protocol.apply((LineProtocol.Cases<Object>) cases));
    }

    @Test
    void aProfileIsOfExactlyTheKindItsCaseNames() {
        for (InstrumentProfile profile : ProfileLibrary.bundled().profiles()) {
            String kind = profile.match(new InstrumentProfile.Cases<String>() {
                @Override
                public String table(TableProfile table) {
                    return "table";
                }

                @Override
                public String serial(SerialProfile serial) {
                    return "serial";
                }

                @Override
                public String waveform(WaveformProfile waveform) {
                    return "waveform";
                }
            });
            // the kinds exclude each other (InstrumentProfile's Javadoc): asTable, asSerial and asWaveform
            // must agree with match, and each must hand back the profile itself
            assertEquals(kind.equals("table") ? List.of(profile) : List.of(), profile.asTable().stream().toList(),
                    profile.name() + ".asTable()");
            assertEquals(kind.equals("serial") ? List.of(profile) : List.of(), profile.asSerial().stream().toList(),
                    profile.name() + ".asSerial()");
            assertEquals(kind.equals("waveform") ? List.of(profile) : List.of(), profile.asWaveform().stream().toList(),
                    profile.name() + ".asWaveform()");
        }
    }
}

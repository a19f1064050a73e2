package org.polebench.sweep;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertSame;

import java.util.List;
import java.util.Optional;
import org.junit.jupiter.api.Test;

/**
 * Control characters an instrument sends (ESC, BEL; ECMA-48 calls ESC '[' the start of a terminal
 * command) never reach a header, a report or the terminal raw: they are written as \\xNN (issue 15).
 */
class ProvenanceTest {
    @Test
    void anInstrumentsControlCharactersAreWrittenAsVisibleEscapes() {
        Provenance provenance = new Provenance(Optional.empty(), "", "ACME\u001b[2J,MODEL\u0007,1.0", "canonical",
                Optional.empty(), Optional.of("B\u00857"), List.of("note\rline", "plain"));
        assertEquals("ACME\\x1b[2J,MODEL\\x07,1.0", provenance.instrument());
        assertEquals("B\\x857", provenance.board().orElseThrow());
        assertEquals(List.of("note\\x0dline", "plain"), provenance.notes());
    }

    @Test
    void printableTextIsKeptAsItIs() {
        String text = "Demo bench analyser (invented), µ ± ° Ω";
        assertSame(text, Provenance.printable(text));
    }
}

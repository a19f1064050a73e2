package org.polebench.cli;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.PrintWriter;
import java.io.StringWriter;
import org.junit.jupiter.api.Test;

/** Control characters in what an instrument says reach the terminal as \xNN (issue 15). */
class CaptureDisplayEscapesTest {
    @Test
    void anIdentityWithEscapeAndBellIsPrintedEscaped() {
        StringWriter out = new StringWriter();
        StringWriter err = new StringWriter();
        CaptureDisplay display = new CaptureDisplay(new PrintWriter(out, true), new PrintWriter(err, true), false);
        display.identified("meter", "Demo\u001b[2J\u0007,LSW-1");
        display.warning("answer \u001b]0;title\u0007");
        // ESC is U+001B and BEL U+0007 (ASCII, ECMA-6); as text they are \x1b and \x07
        assertEquals("meter: Demo\\x1b[2J\\x07,LSW-1" + System.lineSeparator(), out.toString());
        assertTrue(err.toString().contains("answer \\x1b]0;title\\x07"), err.toString());
        assertTrue(out.toString().chars().noneMatch(c -> c == 0x1b || c == 0x07));
    }
}

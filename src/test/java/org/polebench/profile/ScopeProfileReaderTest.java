package org.polebench.profile;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.StringReader;
import java.nio.file.Path;
import org.junit.jupiter.api.Test;
import org.polebench.InputProblem;

class ScopeProfileReaderTest {
    private static final String BASE = String.join("\n",
            "kind: serial-scope",
            "name: test-scope-pair",
            "description: a test pair",
            "instruments:",
            "  gen: {port: {baud: 9600}}",
            "  scope: {port: {baud: 9600}}",
            "set-frequency: {to: gen, send: 'FREQ {frequency_nr3}'}",
            "amplitude: 1 Vpp",
            "units: {amplitude: Vpp}",
            "fetch:",
            "  interval: {to: scope, send: 'XINC?'}",
            "  input: {to: scope, send: 'DATA? 1'}",
            "  output: {to: scope, send: 'DATA? 2'}",
            "");

    private static InstrumentProfile read(String yaml) throws InputProblem {
        return new ProfileReader().read(Path.of("test.yaml"), new StringReader(yaml));
    }

    private static LineProtocol.ScopeFetch scope(InstrumentProfile profile) {
        return profile.asSerial().orElseThrow().protocol().apply(new LineProtocol.Cases<LineProtocol.ScopeFetch>() {
            @Override
            public LineProtocol.ScopeFetch exchange(LineProtocol.ScpiExchange scpi) {
                throw new AssertionError("a scope profile read as SCPI");
            }

            @Override
            public LineProtocol.ScopeFetch stream(LineProtocol.StreamedLines stream) {
                throw new AssertionError("a scope profile read as a stream");
            }

            @Override
            public LineProtocol.ScopeFetch scope(LineProtocol.ScopeFetch scope) {
                return scope;
            }
        });
    }

    @Test
    void readsTheQueriesAndTheDefaults() throws InputProblem {
        LineProtocol.ScopeFetch scope = scope(read(BASE));
        assertEquals(LineProtocol.WaveformFormat.ASCII, scope.format(), "the default format");
        assertEquals("scope", scope.input().instrument());
        assertEquals("DATA? 2", scope.output().query());
        assertTrue(scope.inputScale().isEmpty());
        assertEquals(1.0, scope.amplitude());
        // the profile's own text: FREQ with the NR3 number of 1 kHz
        assertEquals("FREQ 1.000000E+03", scope.setFrequency().render(1000, 1));
    }

    @Test
    void aBlockTakesItsCodingsRangeAsTheRailsWhenNoneAreGiven() throws InputProblem {
        LineProtocol.ScopeFetch scope = scope(read(BASE + "  format: block\n  coding: int16-little-endian\n"
                + "  samples: {unit: codes, volts-per-code: 1m}\n"));
        assertEquals(BlockCoding.INT16_LITTLE_ENDIAN, scope.blockCoding());
        // a signed 16-bit code runs from −32768 to 32767 (two's complement, by definition)
        assertEquals(-32768, scope.coding().lowRail().getAsDouble());
        assertEquals(32767, scope.coding().highRail().getAsDouble());
    }

    @Test
    void everyMistakeNamesItsLineAndAFix() {
        Object[][] cases = {
            {BASE + "  format: block\n", 14, "a block holds codes"},
            {BASE + "  coding: int8\n", 14, "coding applies to format: block"},
            {BASE + "  format: morse\n", 14, "morse"},
            {BASE + "  input-scale: {to: scope, send: 'YINC? 1'}\n", 11, "output-scale"},
            {BASE.replace("'FREQ {frequency_nr3}'", "'FREQ 1000'"), 7, "{frequency_nr3}"},
            {BASE.replace("to: scope, send: 'XINC?'", "to: meter, send: 'XINC?'"), 11, "no instrument named 'meter'"},
            {BASE + "colour: blue\n", 14, "unknown key 'colour'"},
        };
        for (Object[] c : cases) {
            InputProblem problem = assertThrows(InputProblem.class, () -> read((String) c[0]), (String) c[2]);
            assertTrue(problem.getMessage().contains((String) c[2]), problem.describe());
            assertEquals(((Integer) c[1]).longValue(), problem.line(), problem.describe());
            assertTrue(!problem.hint().isBlank());
        }
    }
}

package org.polebench.yaml;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertInstanceOf;
import static org.junit.jupiter.api.Assertions.assertThrows;

import java.io.StringReader;
import java.nio.file.Path;
import org.junit.jupiter.api.Test;
import org.polebench.InputProblem;

class YamlReaderTest {
    private final YamlReader reader = new YamlReader();

    @Test
    void remembersTheLineOfEveryKeyInBlockAndFlowStyle() throws InputProblem {
        String text = "name: demo\n"
                + "parts:\n"
                + "  R1: {resistor: 10k, between: [a, b]}\n"
                + "  C1: {capacitor: 1u, between: [b, gnd]}\n";
        YamlNode.Mapping root = (YamlNode.Mapping) reader.read(Path.of("x.yaml"), new StringReader(text));
        YamlNode.Mapping parts = (YamlNode.Mapping) root.get("parts").orElseThrow();
        assertEquals(3, parts.entry("R1").orElseThrow().line());
        assertEquals(4, parts.entry("C1").orElseThrow().line());
        YamlNode.Mapping c1 = (YamlNode.Mapping) parts.get("C1").orElseThrow();
        assertEquals("1u", ((YamlNode.Scalar) c1.get("capacitor").orElseThrow()).text());
        assertInstanceOf(YamlNode.Sequence.class, c1.get("between").orElseThrow());
    }

    @Test
    void refusesADuplicateKeyNamingItsLine() {
        String text = "a: 1\nb: 2\na: 3\n";
        InputProblem problem = assertThrows(InputProblem.class,
                () -> reader.read(Path.of("d.yaml"), new StringReader(text)));
        assertEquals(3, problem.line());
    }

    @Test
    void reportsBrokenYamlWithALine() {
        String text = "a: 1\nb: [1, 2\nc: 3\n";
        InputProblem problem = assertThrows(InputProblem.class,
                () -> reader.read(Path.of("b.yaml"), new StringReader(text)));
        assertEquals(true, problem.line() > 0);
    }
}

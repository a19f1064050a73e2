package org.polebench.capture;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.ByteArrayOutputStream;
import java.nio.charset.StandardCharsets;
import java.util.Optional;
import org.junit.jupiter.api.Test;
import org.polebench.profile.PortSettings;

/**
 * Definite-length blocks read by their length prefix (IEEE Std 488.2-1992, 8.7.9: '#', a digit
 * n, n digits of byte count, the bytes): each expected block is written here by hand.
 */
class BlockReadingTest {
    private static byte[] bytes(Object... parts) {
        ByteArrayOutputStream out = new ByteArrayOutputStream();
        for (Object part : parts) {
            byte[] b = part instanceof String ? ((String) part).getBytes(StandardCharsets.US_ASCII) : (byte[]) part;
            out.write(b, 0, b.length);
        }
        return out.toByteArray();
    }

    @Test
    void aBlockHoldingLineEndingsArrivingInPiecesIsReadWholeAndTheLineAfterItStaysALine() {
        LineAssembler assembler = new LineAssembler(PortSettings.LineEnding.CRLF);
        byte[] body = {10, 13, 10, 0, -1, 35};   // LF, CR, LF, 0, −1, '#': bytes a line reader would split at
        byte[] wire = bytes("#16", body, "\r\n", "1.5E-03\r\n");
        assembler.expectBlock();
        for (int i = 0; i < wire.length; i += 3) {
            byte[] piece = java.util.Arrays.copyOfRange(wire, i, Math.min(wire.length, i + 3));
            assembler.accept(piece, piece.length);
        }
        BlockAnswer block = assembler.nextBlock().orElseThrow();
        assertTrue(block.refusal().isEmpty());
        assertArrayEquals(bytes("#16", body), block.bytes());
        // the block's own line ending is dropped: the next line is the number after it
        assertEquals(Optional.of("1.5E-03"), assembler.next());
    }

    @Test
    void aBlocksLineEndingArrivingAfterTheNextBlockIsAskedForIsPassedOver() {
        LineAssembler assembler = new LineAssembler(PortSettings.LineEnding.LF);
        assembler.expectBlock();
        byte[] first = bytes("#12", new byte[] {1, 2});
        assembler.accept(first, first.length);
        assertArrayEquals(bytes("#12", new byte[] {1, 2}), assembler.nextBlock().orElseThrow().bytes());
        assembler.expectBlock();
        byte[] rest = bytes("\n#11", new byte[] {3}, "\n");
        assembler.accept(rest, rest.length);
        assertArrayEquals(bytes("#11", new byte[] {3}), assembler.nextBlock().orElseThrow().bytes());
        assertEquals(Optional.empty(), assembler.next());
    }

    @Test
    void aLineWhereABlockWasExpectedIsItsRefusalWithTheText() {
        LineAssembler assembler = new LineAssembler(PortSettings.LineEnding.LF);
        assembler.expectBlock();
        byte[] wire = bytes("-113,\"Undefined header\"\n");
        assembler.accept(wire, wire.length);
        String why = assembler.nextBlock().orElseThrow().refusal().orElseThrow();
        assertTrue(why.contains("a line, not a block") && why.contains("Undefined header"), why);
    }

    @Test
    void malformedHeadersAreRefusedWithTheirReason() {
        Object[][] cases = {
            {"#0abc\n", "indefinite-length"},
            {"#?!!\n", "without its digit count"},
            {"#2x9\n", "not digits"},
        };
        for (Object[] c : cases) {
            LineAssembler assembler = new LineAssembler(PortSettings.LineEnding.LF);
            assembler.expectBlock();
            byte[] wire = bytes(c[0]);
            assembler.accept(wire, wire.length);
            String why = assembler.nextBlock().orElseThrow().refusal().orElseThrow();
            assertTrue(why.contains((String) c[1]), c[0] + ": " + why);
        }
    }

    @Test
    void aBlockCutShortSaysHowMuchArrived() {
        LineAssembler assembler = new LineAssembler(PortSettings.LineEnding.LF);
        assembler.expectBlock();
        byte[] wire = bytes("#210", new byte[4]);
        assembler.accept(wire, wire.length);
        assertTrue(assembler.nextBlock().isEmpty());
        String why = assembler.abandonBlock().orElseThrow();
        assertTrue(why.contains("4 of 10 bytes"), why);
    }
}

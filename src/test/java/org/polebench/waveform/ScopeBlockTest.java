package org.polebench.waveform;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.nio.ByteBuffer;
import java.nio.ByteOrder;
import java.nio.charset.StandardCharsets;
import org.junit.jupiter.api.Test;
import org.polebench.InputProblem;
import org.polebench.profile.BlockCoding;

class ScopeBlockTest {
    private static byte[] block(byte[] payload) {
        // IEEE Std 488.2-1992, 8.7.9: '#', the count of length digits, the length, the bytes
        byte[] header = ("#" + Integer.toString(payload.length).length() + payload.length)
                .getBytes(StandardCharsets.US_ASCII);
        byte[] all = new byte[header.length + payload.length + 1];
        System.arraycopy(header, 0, all, 0, header.length);
        System.arraycopy(payload, 0, all, header.length, payload.length);
        all[all.length - 1] = '\n';     // the answer's line ending, after the block
        return all;
    }

    @Test
    void decodesSixteenBitBlocksInBothByteOrdersAndEightBitOnes() throws InputProblem {
        short[] codes = {0, 1, -1, 32767, -32768, 1234};
        double[] expected = {0, 1, -1, 32767, -32768, 1234};
        for (ByteOrder order : new ByteOrder[] {ByteOrder.BIG_ENDIAN, ByteOrder.LITTLE_ENDIAN}) {
            // an independent encoder: java.nio.ByteBuffer in the stated byte order
            ByteBuffer buffer = ByteBuffer.allocate(codes.length * 2).order(order);
            for (short c : codes) {
                buffer.putShort(c);
            }
            BlockCoding coding = order == ByteOrder.BIG_ENDIAN ? BlockCoding.INT16_BIG_ENDIAN
                    : BlockCoding.INT16_LITTLE_ENDIAN;
            assertArrayEquals(expected, ScopeBlock.definiteLength(block(buffer.array()), coding));
        }
        assertArrayEquals(new double[] {-128, 127, 0}, ScopeBlock.definiteLength(block(new byte[] {-128, 127, 0}),
                BlockCoding.INT8));
    }

    @Test
    void aShortOrMalformedBlockIsAProblem() {
        byte[] whole = block(new byte[10]);
        byte[] cut = java.util.Arrays.copyOf(whole, whole.length - 4);
        InputProblem problem = assertThrows(InputProblem.class,
                () -> ScopeBlock.definiteLength(cut, BlockCoding.INT8));
        assertTrue(problem.getMessage().contains("says 10 bytes but 7 arrived"), problem.getMessage());
        assertThrows(InputProblem.class, () -> ScopeBlock.definiteLength("#0".getBytes(StandardCharsets.US_ASCII),
                BlockCoding.INT8));
        assertThrows(InputProblem.class, () -> ScopeBlock.definiteLength(block(new byte[3]),
                BlockCoding.INT16_BIG_ENDIAN));
    }

    @Test
    void readsAsciiValuesAndNamesTheFirstBadOne() throws InputProblem {
        assertArrayEquals(new double[] {1.5, -2e-3, 0}, ScopeBlock.ascii(" 1.5, -2e-3 ,0\r\n"));
        InputProblem problem = assertThrows(InputProblem.class, () -> ScopeBlock.ascii("1,2,x3,4"));
        assertTrue(problem.getMessage().startsWith("value 3 of the waveform answer ('x3')"), problem.getMessage());
    }
}

package org.polebench.sweepfile;

import java.util.Arrays;

/**
 * The file line of each kept reading, in blocks like {@link DoubleColumn}, as longs: a file past
 * 2³¹ lines is still counted (issue 15).
 */
final class LineColumn {
    private static final int BLOCK_BITS = 14;
    private static final int BLOCK = 1 << BLOCK_BITS;
    private static final int MASK = BLOCK - 1;

    private long[][] blocks = new long[0][];
    private int size;

    void add(long line) {
        int block = size >>> BLOCK_BITS;
        if (block >= blocks.length) {
            blocks = Arrays.copyOf(blocks, Math.max(block + 1, blocks.length * 2));
        }
        long[] current = blocks[block];
        int offset = size & MASK;
        if (current == null || current.length <= offset) {
            // the first block starts small and doubles, so a short sweep costs little
            int length = block == 0 ? Math.min(BLOCK, Math.max(64, 2 * (current == null ? 0 : current.length))) : BLOCK;
            blocks[block] = current == null ? new long[length] : Arrays.copyOf(current, length);
        }
        blocks[block][offset] = line;
        size++;
    }

    long get(int index) {
        if (index < 0 || index >= size) {
            throw new IndexOutOfBoundsException(index);
        }
        return blocks[index >>> BLOCK_BITS][index & MASK];
    }

    void set(int index, long line) {
        if (index < 0 || index >= size) {
            throw new IndexOutOfBoundsException(index);
        }
        blocks[index >>> BLOCK_BITS][index & MASK] = line;
    }

    void truncate(int count) {
        if (count < 0 || count > size) {
            throw new IndexOutOfBoundsException(count);
        }
        size = count;
    }

    LineColumn permuted(int[] index) {
        LineColumn out = new LineColumn();
        for (int i = 0; i < size; i++) {
            out.add(get(index[i]));
        }
        return out;
    }
}

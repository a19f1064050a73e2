package org.polebench.sweepfile;

import java.util.Arrays;

/**
 * A growing column of doubles kept in blocks of {@value #BLOCK} values, so that growing it never
 * copies what it holds (a doubling array briefly needs three times its contents, which is what
 * made a 10-million-row import need 200 bytes a point, issue 15). Every value is NaN until set,
 * and a column that has only ever held NaN owns no memory at all: a file without uncertainty
 * columns, or without phase, pays nothing for them.
 *
 * <p>One instance serves one import and is not shared between threads.
 */
final class DoubleColumn {
    private static final int BLOCK_BITS = 14;
    static final int BLOCK = 1 << BLOCK_BITS;
    private static final int MASK = BLOCK - 1;
    private static final int FIRST_BLOCK = 64;

    private double[][] blocks = new double[0][];
    private int size;
    private boolean holdsNumbers;

    int size() {
        return size;
    }

    /** @return whether any value set so far was a number */
    boolean holdsNumbers() {
        return holdsNumbers;
    }

    void add(double value) {
        size++;
        set(size - 1, value);
    }

    double get(int index) {
        if (index < 0 || index >= size) {
            throw new IndexOutOfBoundsException(index);
        }
        return holdsNumbers ? blocks[index >>> BLOCK_BITS][index & MASK] : Double.NaN;
    }

    void set(int index, double value) {
        if (index < 0 || index >= size) {
            throw new IndexOutOfBoundsException(index);
        }
        if (!holdsNumbers && Double.isNaN(value)) {
            return;
        }
        if (!holdsNumbers) {
            holdsNumbers = true;
            reach(size - 1);
        } else {
            reach(index);
        }
        blocks[index >>> BLOCK_BITS][index & MASK] = value;
    }

    /** Drops every value from {@code count} on. */
    void truncate(int count) {
        if (count < 0 || count > size) {
            throw new IndexOutOfBoundsException(count);
        }
        size = count;
    }

    /** @return a new column holding this one's values in the order {@code index} gives */
    DoubleColumn permuted(int[] index) {
        DoubleColumn out = new DoubleColumn();
        for (int i = 0; i < size; i++) {
            out.add(get(index[i]));
        }
        return out;
    }

    /**
     * @return the values as one array of exactly {@link #size()}, or null when the column never
     *         held a number; the column lets go of its blocks, so the copy costs no more than the
     *         largest of them at a time
     */
    double[] release() {
        if (!holdsNumbers) {
            blocks = new double[0][];
            return null;
        }
        double[] out = new double[size];
        for (int b = 0; b * BLOCK < size; b++) {
            int from = b * BLOCK;
            System.arraycopy(blocks[b], 0, out, from, Math.min(BLOCK, size - from));
            blocks[b] = null;
        }
        blocks = new double[0][];
        size = 0;
        holdsNumbers = false;
        return out;
    }

    /** Makes room up to {@code index}, filling new room with NaN. */
    private void reach(int index) {
        int block = index >>> BLOCK_BITS;
        if (block < blocks.length && blocks[block] != null && blocks[block].length > (index & MASK)) {
            return;
        }
        if (block >= blocks.length) {
            blocks = Arrays.copyOf(blocks, Math.max(block + 1, blocks.length * 2));
        }
        for (int b = 0; b <= block; b++) {
            // the first block starts small and doubles, so a 100-point sweep costs 100 values, not a block
            int needed = b < block ? BLOCK : (index & MASK) + 1;
            double[] current = blocks[b];
            if (current == null || current.length < needed) {
                int length = b == 0 ? Math.min(BLOCK, Math.max(FIRST_BLOCK, Math.max(needed, 2 * lengthOf(current))))
                        : BLOCK;
                double[] grown = current == null ? new double[length] : Arrays.copyOf(current, length);
                Arrays.fill(grown, lengthOf(current), length, Double.NaN);
                blocks[b] = grown;
            }
        }
    }

    private static int lengthOf(double[] block) {
        return block == null ? 0 : block.length;
    }
}

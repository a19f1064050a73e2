package org.polebench.reconcile;

import java.util.Arrays;

/**
 * The assignment of rows to columns of a square cost matrix that has the least total cost: the
 * Hungarian method (H. W. Kuhn, "The Hungarian method for the assignment problem", Naval Research
 * Logistics Quarterly 2, 1955; J. Munkres, "Algorithms for the assignment and transportation
 * problems", J. SIAM 5, 1957), in its O(n³) form with row and column potentials and shortest
 * augmenting paths (from memory). The matrices here are a few roots on a side (n ≤ 20), so no
 * library is needed; Commons Math 3.6.1 has none.
 */
final class MinimumCostAssignment {
    private MinimumCostAssignment() {
    }

    /**
     * @param cost a square matrix of finite costs, cost[row][column]
     * @return for every row the column assigned to it; each column is used once
     */
    static int[] solve(double[][] cost) {
        int n = cost.length;
        for (double[] row : cost) {
            if (row.length != n) {
                throw new IllegalArgumentException("the cost matrix must be square, was " + n + "×" + row.length);
            }
            for (double c : row) {
                if (!Double.isFinite(c)) {
                    throw new IllegalArgumentException("costs must be finite, was " + c);
                }
            }
        }
        // 1-based arrays: index 0 is the virtual column that starts each augmenting path
        double[] rowPotential = new double[n + 1];
        double[] columnPotential = new double[n + 1];
        int[] rowOfColumn = new int[n + 1];
        int[] previousColumn = new int[n + 1];
        for (int row = 1; row <= n; row++) {
            rowOfColumn[0] = row;
            int column = 0;
            double[] slack = new double[n + 1];
            Arrays.fill(slack, Double.POSITIVE_INFINITY);
            boolean[] used = new boolean[n + 1];
            do {
                used[column] = true;
                int r = rowOfColumn[column];
                double delta = Double.POSITIVE_INFINITY;
                int next = -1;
                for (int j = 1; j <= n; j++) {
                    if (used[j]) {
                        continue;
                    }
                    double reduced = cost[r - 1][j - 1] - rowPotential[r] - columnPotential[j];
                    if (reduced < slack[j]) {
                        slack[j] = reduced;
                        previousColumn[j] = column;
                    }
                    if (slack[j] < delta) {
                        delta = slack[j];
                        next = j;
                    }
                }
                for (int j = 0; j <= n; j++) {
                    if (used[j]) {
                        rowPotential[rowOfColumn[j]] += delta;
                        columnPotential[j] -= delta;
                    } else {
                        slack[j] -= delta;
                    }
                }
                column = next;
            } while (rowOfColumn[column] != 0);
            // flip the augmenting path back to its start
            do {
                int before = previousColumn[column];
                rowOfColumn[column] = rowOfColumn[before];
                column = before;
            } while (column != 0);
        }
        int[] columnOfRow = new int[n];
        for (int j = 1; j <= n; j++) {
            columnOfRow[rowOfColumn[j] - 1] = j - 1;
        }
        return columnOfRow;
    }
}

package org.polebench.analysis;

/**
 * An upper bound on the largest eigenvalue magnitude of a square matrix: the smaller of the
 * row-sum and column-sum norms after diagonal balancing by powers of two (Parlett and Reinsch,
 * "Balancing a matrix for calculation of eigenvalues and eigenvectors", Numer. Math. 13, 1969).
 * Balancing is a similarity, so the bound holds; on a port-reduced A, whose transconductance
 * terms make ‖A‖∞ hundreds of times the largest pole, it brings the bound near the pole.
 */
final class SpectralBound {
    private static final int MAX_SWEEPS = 30;

    private SpectralBound() {
    }

    /** @param a not changed */
    static double of(double[][] a) {
        int n = a.length;
        double[][] b = new double[n][];
        for (int i = 0; i < n; i++) {
            b[i] = a[i].clone();
        }
        boolean converged = false;
        for (int sweep = 0; sweep < MAX_SWEEPS && !converged; sweep++) {
            converged = true;
            for (int i = 0; i < n; i++) {
                converged &= !balance(b, i);
            }
        }
        double rowNorm = 0;
        double columnNorm = 0;
        for (int i = 0; i < n; i++) {
            rowNorm = Math.max(rowNorm, rowSum(b, i, -1));
            columnNorm = Math.max(columnNorm, columnSum(b, i, -1));
        }
        return Math.min(rowNorm, columnNorm);
    }

    /** @return true when row and column i were scaled, by the power of two that evens their sums */
    private static boolean balance(double[][] b, int i) {
        double column = columnSum(b, i, i);
        double row = rowSum(b, i, i);
        if (column == 0 || row == 0) {
            return false;
        }
        double sum = column + row;
        double f = 1;
        double g = row / 2;
        while (column < g) {
            f *= 2;
            column *= 4;
        }
        g = row * 2;
        while (column >= g) {
            f /= 2;
            column /= 4;
        }
        if (!((column + row) / f < 0.95 * sum)) {
            return false;
        }
        for (int j = 0; j < b.length; j++) {
            b[i][j] /= f;
            b[j][i] *= f;
        }
        return true;
    }

    /** @return Σ_j |b_ij| over j ≠ skip (one loop per call: see {@link org.polebench.circuit.RealLu}) */
    private static double rowSum(double[][] b, int i, int skip) {
        return absoluteSum(b, i, skip, false);
    }

    /** @return Σ_j |b_ji| over j ≠ skip */
    private static double columnSum(double[][] b, int i, int skip) {
        return absoluteSum(b, i, skip, true);
    }

    private static double absoluteSum(double[][] b, int i, int skip, boolean column) {
        double sum = 0;
        for (int j = 0; j < b.length; j++) {
            if (j != skip) {
                sum += Math.abs(column ? b[j][i] : b[i][j]);
            }
        }
        return sum;
    }
}

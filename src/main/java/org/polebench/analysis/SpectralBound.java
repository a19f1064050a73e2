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
        // the largest row sum and column sum of |b|
        double[] norms = new double[2];
        for (int i = 0; i < n; i++) {
            addSums(b, i, norms);
        }
        return Math.min(norms[0], norms[1]);
    }

    /** @return true when row and column i were scaled, by the power of two that evens their sums */
    private static boolean balance(double[][] b, int i) {
        int n = b.length;
        double column = 0;
        double row = 0;
        for (int j = 0; j < n; j++) {
            if (j != i) {
                column += Math.abs(b[j][i]);
                row += Math.abs(b[i][j]);
            }
        }
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
        for (int j = 0; j < n; j++) {
            b[i][j] /= f;
            b[j][i] *= f;
        }
        return true;
    }

    /**
     * Raises {@code sums} to row i's Σ_j |b_ij| and column i's Σ_j |b_ji| (one loop per call:
     * see {@link org.polebench.linalg.RealLu}).
     */
    private static void addSums(double[][] b, int i, double[] sums) {
        double row = 0;
        double column = 0;
        for (int j = 0; j < b.length; j++) {
            row += Math.abs(b[i][j]);
            column += Math.abs(b[j][i]);
        }
        sums[0] = Math.max(sums[0], row);
        sums[1] = Math.max(sums[1], column);
    }
}

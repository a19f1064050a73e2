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
                double column = 0;
                double row = 0;
                for (int j = 0; j < n; j++) {
                    if (j != i) {
                        column += Math.abs(b[j][i]);
                        row += Math.abs(b[i][j]);
                    }
                }
                if (column == 0 || row == 0) {
                    continue;
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
                if ((column + row) / f < 0.95 * sum) {
                    converged = false;
                    for (int j = 0; j < n; j++) {
                        b[i][j] /= f;
                        b[j][i] *= f;
                    }
                }
            }
        }
        double rowNorm = 0;
        double columnNorm = 0;
        for (int i = 0; i < n; i++) {
            double r = 0;
            double c = 0;
            for (int j = 0; j < n; j++) {
                r += Math.abs(b[i][j]);
                c += Math.abs(b[j][i]);
            }
            rowNorm = Math.max(rowNorm, r);
            columnNorm = Math.max(columnNorm, c);
        }
        return Math.min(rowNorm, columnNorm);
    }
}

/**
 * Dense linear-algebra kernels on plain {@code double} arrays, each with its published source:
 * the real LU with partial pivoting ({@link org.polebench.linalg.RealLu}), the complex LU
 * ({@link org.polebench.linalg.ComplexLu}), the LU of the port equations swept over many
 * frequencies at once ({@link org.polebench.linalg.SweptPortEquations}), the Householder QR
 * of least squares ({@link org.polebench.linalg.HouseholderQr}, which keeps the normal
 * equations from ever being formed) and the eigenvalue recipe for a non-symmetric matrix
 * ({@link org.polebench.linalg.EigenSolver}, docs/method.md, "Poles and zeros").
 * Uses no other polebench package (Commons Math does the Schur step); knows nothing of circuits,
 * sweeps or units.
 */
package org.polebench.linalg;

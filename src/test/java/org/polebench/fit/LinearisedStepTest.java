package org.polebench.fit;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.Random;
import java.util.stream.Collectors;
import org.ejml.data.DMatrixRMaj;
import org.ejml.dense.row.CommonOps_DDRM;
import org.ejml.dense.row.NormOps_DDRM;
import org.ejml.dense.row.factory.LinearSolverFactory_DDRM;
import org.ejml.interfaces.linsol.LinearSolverDense;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.ValueSource;
import org.polebench.InputProblem;
import org.polebench.sweep.Sweep;
import org.polebench.sweep.SweepPoint;

class LinearisedStepTest {
    // a common-emitter stage, noisy (seed 21), so the system is a real overdetermined one
    private static final KnownResponse STAGE = new KnownResponse(42, 2, KnownResponse.real(-4.2),
            KnownResponse.real(-3, -16, -180), Double.NaN);

    /**
     * The same Sanathanan–Koerner system solved by EJML's Householder least squares (an
     * independent library): both must reach the same minimum of ‖A·c − b‖.
     */
    @ParameterizedTest
    @ValueSource(booleans = {true, false})
    void linearisedStepMatchesAnIndependentLeastSquaresSolve(boolean withPhase) throws InputProblem {
        Random random = new Random(21);
        Sweep noisy = STAGE.noisySweep(KnownResponse.logSpaced(1, 50_000, 100), 0.05, 0.5, random, true);
        if (!withPhase) {
            noisy = new Sweep(noisy.source(), noisy.points().stream()
                    .map(p -> SweepPoint.magnitudeOnly(p.frequencyHz(), p.gainDb())).collect(Collectors.toList()));
        }
        PreparedSweep data = PreparedSweep.of(noisy, FitSettings.defaults());
        SanathananKoerner sk = new SanathananKoerner();
        // a second-step system: D_prev from a first estimate, as inside the iteration
        RationalEstimate first = sk.estimate(data, 2, 1, 3, Double.NaN);
        LinearisedSystem system = sk.system(data, 2, 1, 3, first.denominator, null, Double.NaN);
        double[] ours = sk.solve(system);

        DMatrixRMaj a = new DMatrixRMaj(system.copyOfMatrix());
        DMatrixRMaj b = new DMatrixRMaj(system.rows(), 1, true, system.copyOfRhs());
        DMatrixRMaj x = new DMatrixRMaj(system.columns(), 1);
        LinearSolverDense<DMatrixRMaj> solver = LinearSolverFactory_DDRM.leastSquares(system.rows(), system.columns());
        assertTrue(solver.setA(a.copy()));
        solver.solve(b, x);

        double ejmlResidual = residualNorm(a, b, x);
        double ourResidual = residualNorm(a, b, new DMatrixRMaj(ours.length, 1, true, ours));
        // same minimum: differences in the residual norm are round-off of a system whose columns
        // span about eight decades (cond ≈ 1e8 × 1e-16 ≈ 1e-8 relative)
        assertEquals(ejmlResidual, ourResidual, 1e-8 * ejmlResidual);
        for (int j = 0; j < ours.length; j++) {
            assertEquals(x.get(j), ours[j], 1e-6 * Math.abs(x.get(j)) + 1e-12, "coefficient " + j);
        }
    }

    private static double residualNorm(DMatrixRMaj a, DMatrixRMaj b, DMatrixRMaj x) {
        DMatrixRMaj r = new DMatrixRMaj(b.numRows, 1);
        CommonOps_DDRM.mult(a, x, r);
        CommonOps_DDRM.subtractEquals(r, b);
        return NormOps_DDRM.normF(r);
    }
}

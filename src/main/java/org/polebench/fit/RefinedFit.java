package org.polebench.fit;

/**
 * A candidate model after Levenberg–Marquardt: its parameters, χ² with the points' own
 * uncertainties, and (JᵀWJ)⁻¹ at the optimum (null when JᵀWJ is singular: the structure has
 * more parameters than the data determine).
 */
final class RefinedFit {
    final RationalModel model;
    final double[] parameters;
    final double chiSquare;
    final double[][] inverseInformation;
    final int residuals;

    RefinedFit(RationalModel model, double[] parameters, double chiSquare, double[][] inverseInformation,
               int residuals) {
        this.model = model;
        this.parameters = parameters;
        this.chiSquare = chiSquare;
        this.inverseInformation = inverseInformation;
        this.residuals = residuals;
    }

    ModelStructure structure() {
        return model.structure();
    }

    int degreesOfFreedom() {
        return residuals - parameters.length;
    }
}

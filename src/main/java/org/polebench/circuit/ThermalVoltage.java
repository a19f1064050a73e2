package org.polebench.circuit;

/**
 * The thermal voltage VT = kT/q from the exact SI values of the Boltzmann constant and the
 * elementary charge (BIPM, The International System of Units, 9th edition, 2019, table 1).
 */
public final class ThermalVoltage {
    /** Boltzmann constant k, exact since the 2019 SI redefinition, in J/K. */
    public static final double BOLTZMANN_JOULES_PER_KELVIN = 1.380649e-23;
    /** Elementary charge q, exact since the 2019 SI redefinition, in C. */
    public static final double ELEMENTARY_CHARGE_COULOMBS = 1.602176634e-19;

    private ThermalVoltage() {
    }

    /**
     * @param kelvin absolute temperature, positive
     * @return kT/q in volts (25.852 mV at 300 K)
     */
    public static double volts(double kelvin) {
        if (!(kelvin > 0) || !Double.isFinite(kelvin)) {
            throw new IllegalArgumentException("temperature must be positive, was " + kelvin);
        }
        return BOLTZMANN_JOULES_PER_KELVIN * kelvin / ELEMENTARY_CHARGE_COULOMBS;
    }
}

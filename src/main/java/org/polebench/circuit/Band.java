package org.polebench.circuit;

/**
 * Which analysis a capacitor belongs to. Low-band capacitors (coupling and bypass parts, by
 * default any part capacitor of 1 nF or more) are the ports of the SCTC analysis; high-band
 * ones (device and small capacitors) are open in it and are the ports of the OCTC analysis.
 */
public enum Band {
    LOW, HIGH
}

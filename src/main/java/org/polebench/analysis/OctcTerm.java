package org.polebench.analysis;

/**
 * One high-band capacitor's open-circuit time constant (Gray and Searle, Electronic
 * Principles, 1969; Sedra and Smith, Microelectronic Circuits, from memory).
 *
 * @param capacitor the part's name
 * @param farads    its value
 * @param ohms      R_i° = (Y⁻¹)_ii: the resistance it sees with the other high-band capacitors
 *                  open and the low-band ones shorted
 * @param seconds   τ_i° = C_i·R_i°
 * @param share     τ_i° / Σ τ_j°
 */
public record OctcTerm(String capacitor, double farads, double ohms, double seconds, double share) {
}

package org.polebench.analysis;

/**
 * One capacitor's short-circuit time constant (Gray and Searle, Electronic Principles, 1969;
 * Sedra and Smith, Microelectronic Circuits, from memory).
 *
 * @param capacitor     the part's name
 * @param farads        its value
 * @param ohms          R_i = 1/Y_ii: the resistance it sees with every other low-band capacitor shorted
 * @param seconds       τ_i = C_i·R_i
 * @param share         (1/τ_i) / Σ(1/τ_j): its share of the SCTC corner estimate
 */
public record SctcTerm(String capacitor, double farads, double ohms, double seconds, double share) {
}

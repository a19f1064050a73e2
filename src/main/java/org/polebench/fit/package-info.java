/**
 * Fits a rational low-frequency model H(s) = K·sᵐ·Π(s − zᵢ)/Π(s − pᵢ) (optionally times one
 * high-band pole) to a bench sweep, chooses its order by an information criterion, and states
 * the uncertainty of every pole, zero, the midband gain and the lower −3 dB corner
 * (GUM, JCGM 100:2008). Uses units, linalg (the QR least-squares kernel) and sweep; knows nothing of circuits or reports.
 */
package org.polebench.fit;

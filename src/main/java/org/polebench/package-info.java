/**
 * polebench: reconciles an amplifier stage as designed with the same stage as built.
 * The root package holds only what every package shares: the checked
 * {@link org.polebench.InputProblem} and the {@link org.polebench.InputWarning} value.
 */
package org.polebench;

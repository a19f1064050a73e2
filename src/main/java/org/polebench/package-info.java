/**
 * polebench: reconciles an amplifier stage as designed with the same stage as built.
 * The root package holds only what every package shares: the checked
 * {@link org.polebench.InputProblem}, the {@link org.polebench.InputWarning} value, and
 * {@link org.polebench.OutputFile}, the one atomic writer of the files made for the user.
 */
package org.polebench;

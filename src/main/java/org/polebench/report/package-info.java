/**
 * What polebench hands to people and other programs: the fit summary as text and JSON, and
 * Bode plots (JFreeChart, written as SVG through JFreeSVG or as PNG). Uses fit, measure and
 * units; computes nothing that the fit did not already state.
 */
package org.polebench.report;

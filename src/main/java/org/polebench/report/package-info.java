/**
 * What polebench writes for people and programs: plain-text summaries, JSON objects, CSV
 * tables, Bode plots (JFreeChart, as SVG through JFreeSVG or as PNG) and the HTML test
 * report (ReportHtml, from the result JSON of ResultJson). Uses units, circuit, analysis,
 * spread, bench, sweep, fit, reconcile and lot (the lot report); computes nothing that the library does not already hold.
 */
package org.polebench.report;

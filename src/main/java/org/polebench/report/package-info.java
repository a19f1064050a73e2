/**
 * What polebench writes for people and programs: plain-text summaries, JSON objects, CSV
 * tables, Bode plots (JFreeChart, as SVG through JFreeSVG or as PNG) and the HTML test
 * report (ReportHtml, from the result JSON of ResultJson). Uses units, circuit, analysis,
 * spread, bench, sweep, fit, reconcile, lot (the lot report) and ledger (a batch's progress and
 * summary, a board's history); computes nothing that the library does not already hold.
 */
package org.polebench.report;

/**
 * What polebench writes for people and programs: plain-text summaries, JSON objects, CSV
 * tables, charts and the HTML test report. Uses every package below it; computes nothing
 * that the library does not already hold.
 */
package org.polebench.report;

/**
 * The results ledger: every board's test recorded once in one transaction (SQLite by default,
 * PostgreSQL for many stations; one schema versioned by Flyway migrations), the batch that
 * reconciles many sweeps and records them, and the queries a lot and a board's history read.
 * Uses the root package and units, circuit, analysis, spread, bench, sweep, profile, sweepfile,
 * fit, reconcile, lot.
 */
package org.polebench.ledger;

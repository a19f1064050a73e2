package org.polebench.lot;

/**
 * One board's value on the individuals chart.
 *
 * @param testOrder the ledger's sequence number of the test
 * @param boardId   the board
 * @param value     its value (Hz or dB)
 */
public record ChartPoint(long testOrder, String boardId, double value) {
}

/**
 * Engineering notation ({@code 4.7u}, {@code 4u7}, {@code 10k}, {@code 2.2 µF}), SI prefixes,
 * decibels and angles. Uses no other polebench package; knows nothing of circuits or sweeps.
 */
package org.polebench.units;

package org.polebench.lot;

/**
 * The run rules of the individuals chart: the four rules of the Western Electric Company's
 * Statistical Quality Control Handbook (1956), as Montgomery, Introduction to Statistical
 * Quality Control, lists them ("sensitizing rules"). Zones are counted in σ from the centre line.
 */
public enum RunRule {
    /** One point beyond 3σ. */
    BEYOND_3_SIGMA(1, "one point beyond 3σ"),
    /** Two of three consecutive points beyond 2σ on the same side. */
    TWO_OF_THREE_BEYOND_2_SIGMA(2, "two of three consecutive points beyond 2σ on one side"),
    /** Four of five consecutive points beyond 1σ on the same side. */
    FOUR_OF_FIVE_BEYOND_1_SIGMA(3, "four of five consecutive points beyond 1σ on one side"),
    /** Eight consecutive points on the same side of the centre line. */
    EIGHT_ON_ONE_SIDE(4, "eight consecutive points on one side of the centre line");

    private final int number;
    private final String words;

    RunRule(int number, String words) {
        this.number = number;
        this.words = words;
    }

    /** @return the rule's number in the Western Electric handbook, 1 to 4 */
    public int number() {
        return number;
    }

    /** @return the rule in words */
    public String words() {
        return words;
    }
}

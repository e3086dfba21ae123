package org.specimenledger.specimens;

/**
 * Geometry that the test-piece rules do not allow, naming the input at fault by its ISO 6892-1 symbol
 * ({@code d}, {@code a}, {@code D}, {@code du}, {@code k}, {@code L0}, {@code S0}...) and, for one reading of a
 * dimension, its index from 0.
 */
public class GeometryRefused extends IllegalArgumentException {

    private final String symbol;
    private final Integer index;

    public GeometryRefused(String symbol, Integer index, String message) {
        super(message);
        this.symbol = symbol;
        this.index = index;
    }

    public GeometryRefused(String symbol, String message) {
        this(symbol, null, message);
    }

    /** The symbol of the input at fault. */
    public String symbol() {
        return symbol;
    }

    /** The index (from 0) of the reading at fault, or null when the whole input is. */
    public Integer index() {
        return index;
    }
}

package org.specimenledger.curve;

import java.util.Objects;

/**
 * A known channel as found in a file's header row.
 *
 * @param channel which quantity the column carries
 * @param unit the unit symbol exactly as written in the header, e.g. {@code "kN"}; the values in
 *     {@link RawCurve} are already converted to {@link Channel#canonicalUnit()}
 * @param column 1-based column (cell) number in the file, at least 1
 */
public record ChannelColumn(Channel channel, String unit, int column) {

    /**
     * Checks the values.
     *
     * @throws NullPointerException if channel or unit is null
     * @throws IllegalArgumentException if column is below 1
     */
    public ChannelColumn {
        Objects.requireNonNull(channel, "channel");
        Objects.requireNonNull(unit, "unit");
        if (column < 1) {
            throw new IllegalArgumentException("column must be at least 1, was " + column);
        }
    }
}

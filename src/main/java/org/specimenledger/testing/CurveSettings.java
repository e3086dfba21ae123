package org.specimenledger.testing;

import org.specimenledger.curve.CurveReadingLimits;
import org.springframework.boot.context.properties.ConfigurationProperties;
import org.springframework.boot.context.properties.bind.DefaultValue;
import org.springframework.util.unit.DataSize;

/**
 * Limits for raw curve files: the largest accepted file and the fewest data points.
 *
 * @param maxSize   largest curve file ({@code ledger.curves.max-size}, default 64MB)
 * @param minPoints fewest data rows a curve must have (default 20)
 * @param maxPoints most data rows a curve may have ({@code ledger.curves.max-points}, default 5,000,000)
 */
@ConfigurationProperties("ledger.curves")
public record CurveSettings(@DefaultValue("64MB") DataSize maxSize, @DefaultValue("20") int minPoints,
        @DefaultValue("5000000") int maxPoints) {

    public CurveReadingLimits limits() {
        return new CurveReadingLimits(maxSize.toBytes(), minPoints, maxPoints);
    }
}

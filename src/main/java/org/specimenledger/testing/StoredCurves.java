package org.specimenledger.testing;

import org.specimenledger.curve.CurveReader;
import org.specimenledger.curve.RawCurve;

/** Reads a stored curve file again. The size limit never refuses a file that was accepted when the limit was higher. */
final class StoredCurves {

    private StoredCurves() {
    }

    static RawCurve read(byte[] bytes, CurveSettings settings) {
        long limit = Math.max(settings.maxSize().toBytes(), bytes.length);
        // a stored curve was accepted under the limits of its day: a lower point limit set later must not refuse it
        return new CurveReader(settings.limits().withMaxBytes(limit).withMaxPoints(Integer.MAX_VALUE)).read(bytes);
    }
}

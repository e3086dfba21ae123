package org.specimenledger.testing;

import org.specimenledger.curve.CurveReader;
import org.specimenledger.curve.RawCurve;

/** Reads a stored curve file again. The size limit never refuses a file that was accepted when the limit was higher. */
final class StoredCurves {

    private StoredCurves() {
    }

    static RawCurve read(byte[] bytes, CurveSettings settings) {
        long limit = Math.max(settings.maxSize().toBytes(), bytes.length);
        return new CurveReader(settings.limits().withMaxBytes(limit)).read(bytes);
    }
}

package org.specimenledger.testsupport;

import java.math.BigDecimal;
import java.time.LocalDate;
import java.time.OffsetDateTime;
import java.time.ZoneOffset;
import java.util.HashMap;
import java.util.Map;

/**
 * The one test-run registration body the tests of several packages send: a tensile test by ISO 6892-1 method A1
 * on the 100 kN range, at 21.5 °C, yesterday (UTC) at 10:00 +01:00. Each caller adds or replaces what it is about.
 */
public final class TestRunBodies {

    private TestRunBodies() {
    }

    /** A mutable registration body for a specimen on a machine, its force transducer and an extensometer. */
    public static Map<String, Object> registration(String specimenId, String machineId, String transducerId,
            String extensometerId) {
        Map<String, Object> m = new HashMap<>();
        m.put("specimenId", specimenId);
        m.put("machineId", machineId);
        m.put("forceTransducerId", transducerId);
        m.put("forceRangeN", 100000);
        m.put("extensometerId", extensometerId);
        m.put("testedAt", testedAt().toString());
        m.put("temperatureC", new BigDecimal("21.5"));
        m.put("standard", "ISO_6892_1");
        m.put("method", "A1");
        m.put("standardReference", "ISO 6892-1:2019");
        m.put("nominalStrainRatePerS", new BigDecimal("0.00025"));
        m.put("mode", "TENSILE");
        return m;
    }

    /** Yesterday (UTC) at 10:00 +01:00: inside every calibration the fixtures record (two months ago to months ahead). */
    public static OffsetDateTime testedAt() {
        return LocalDate.now(ZoneOffset.UTC).minusDays(1).atTime(10, 0).atOffset(ZoneOffset.ofHours(1));
    }
}

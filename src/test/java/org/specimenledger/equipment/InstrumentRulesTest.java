package org.specimenledger.equipment;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;
import static org.specimenledger.equipment.EquipmentFixtures.range;

import java.math.BigDecimal;
import java.util.List;
import java.util.Map;
import java.util.Optional;
import java.util.UUID;
import java.util.function.Function;
import org.junit.jupiter.api.Test;
import org.specimenledger.shared.FieldIssue;
import org.specimenledger.shared.RuleViolation;

class InstrumentRulesTest {

    private static final Function<UUID, Optional<InstrumentKind>> NOTHING_STORED = id -> Optional.empty();

    private static EquipmentRequests.InstrumentRequest request(InstrumentKind kind,
            List<EquipmentRequests.ForceRangeRequest> ranges, String gaugeLength, List<UUID> transducers) {
        return new EquipmentRequests.InstrumentRequest("X-1", kind, "d", null, null, null, null, ranges,
                gaugeLength == null ? null : new BigDecimal(gaugeLength), null, transducers, null);
    }

    private static List<FieldIssue> issues(EquipmentRequests.InstrumentRequest r,
            Function<UUID, Optional<InstrumentKind>> kindOf) {
        try {
            InstrumentRules.checked(r, kindOf);
        } catch (RuleViolation e) {
            return e.issues();
        }
        throw new AssertionError("expected a rule violation");
    }

    /** ISO 7500-1 verifies a force range from 20 % of its upper limit [from memory]. */
    @Test
    void lowerLimitDefaultsToTwentyPercentOfTheRange() {
        List<ForceRange> ranges = InstrumentRules.checked(request(InstrumentKind.FORCE_TRANSDUCER,
                List.of(range("10000", null), range("2500", null), range("50000", "5000")), null, null),
                NOTHING_STORED);
        assertThat(ranges).extracting(r -> r.lowerLimitN().toPlainString()).containsExactly("2000", "500", "5000");
        assertThat(InstrumentRules.defaultLowerLimit(new BigDecimal("12.5")).toPlainString()).isEqualTo("2.5");
        assertThat(InstrumentRules.defaultLowerLimit(new BigDecimal("1E+5")).toPlainString()).isEqualTo("20000");
    }

    @Test
    void forceTransducerNeedsRangesThatAreDistinctWithLowerBelowUpper() {
        assertThat(issues(request(InstrumentKind.FORCE_TRANSDUCER, List.of(), null, null), NOTHING_STORED))
                .extracting(FieldIssue::pointer).containsExactly("/forceRanges");
        List<FieldIssue> issues = issues(request(InstrumentKind.FORCE_TRANSDUCER,
                List.of(range("10000", null), range("10000.0", null), range("5000", "5000")), null, null),
                NOTHING_STORED);
        assertThat(issues).extracting(FieldIssue::pointer)
                .containsExactly("/forceRanges/1/upperLimitN", "/forceRanges/2/lowerLimitN");
        assertThat(issues.get(1).detail()).isEqualTo("lower limit 5000 N is not below the range's upper limit 5000 N");
    }

    @Test
    void dataOfAnotherKindIsRefusedNotDropped() {
        List<FieldIssue> issues = issues(request(InstrumentKind.EXTENSOMETER, List.of(range("100", null)), null,
                List.of(UUID.randomUUID())), NOTHING_STORED);
        assertThat(issues).extracting(FieldIssue::pointer)
                .containsExactly("/forceRanges", "/gaugeLengthMm", "/builtInTransducerIds");
        assertThat(issues(request(InstrumentKind.FORCE_TRANSDUCER, List.of(range("100", null)), "50", null),
                NOTHING_STORED)).extracting(FieldIssue::pointer).containsExactly("/gaugeLengthMm");
    }

    @Test
    void machineNamesOnlyStoredForceTransducers() {
        UUID cell = UUID.randomUUID();
        UUID extensometer = UUID.randomUUID();
        UUID unknown = UUID.randomUUID();
        Map<UUID, InstrumentKind> stored = Map.of(cell, InstrumentKind.FORCE_TRANSDUCER, extensometer,
                InstrumentKind.EXTENSOMETER);
        Function<UUID, Optional<InstrumentKind>> kindOf = id -> Optional.ofNullable(stored.get(id));
        assertThat(InstrumentRules.checked(request(InstrumentKind.TESTING_MACHINE, null, null, List.of(cell)), kindOf))
                .isEmpty();
        List<FieldIssue> issues = issues(request(InstrumentKind.TESTING_MACHINE, null, null,
                List.of(cell, extensometer, unknown, cell)), kindOf);
        assertThat(issues).extracting(FieldIssue::pointer).containsExactly("/builtInTransducerIds/1",
                "/builtInTransducerIds/2", "/builtInTransducerIds/3");
        assertThat(issues.get(0).detail()).endsWith("is a EXTENSOMETER, not a FORCE_TRANSDUCER");
    }

    @Test
    void extensometerNeedsGaugeLength() {
        assertThatThrownBy(() -> InstrumentRules.checked(request(InstrumentKind.EXTENSOMETER, null, null, null),
                NOTHING_STORED)).isInstanceOf(RuleViolation.class).hasMessageContaining("gauge length");
    }
}

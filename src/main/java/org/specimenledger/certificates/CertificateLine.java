package org.specimenledger.certificates;

import java.math.BigDecimal;
import java.util.List;
import java.util.UUID;

/**
 * One line of a certificate: a specimen's reported property from a recorded analysis, against the order's
 * requirement, with the verdict. Values stay in SI as the analysis stored them ({@code value} at full precision,
 * {@code reported} the rounded text, {@code rounding} the rule that rounded it), so a later view can print other
 * units without touching the stored record.
 *
 * @param status         the analysis status: DETERMINED, NOT_APPLICABLE or NOT_DETERMINABLE (or MISSING when the
 *                       analysis has no such property)
 * @param requirementMin null when the requirement has no minimum (or there is no requirement)
 * @param verdict        the {@link org.specimenledger.analysis.conformity.Verdict} name; null for a property
 *                       reported without a requirement
 * @param flags          the codes of the analysis flags attached to this property
 */
public record CertificateLine(int position, UUID specimenId, String specimenLabel, UUID heatId, String heatNumber,
        UUID testRunId, UUID analysisRunId, String property, String status, Double value, String unit, String reported,
        String rounding, Double expandedUncertainty, BigDecimal requirementMin, BigDecimal requirementMax,
        String requirementUnit, BigDecimal thicknessMinMm, BigDecimal thicknessMaxMm, String verdict,
        String verdictReason, List<String> flags) {

    public CertificateLine {
        flags = List.copyOf(flags);
    }

    /** True when the line has a requirement whose verdict is a pass or a conditional pass. */
    public boolean passes() {
        return verdict == null || "PASS".equals(verdict) || "CONDITIONAL_PASS".equals(verdict);
    }

    /** Same content as {@code other}, comparing decimals by value (jsonb may change their scale). */
    boolean sameAs(CertificateLine other) {
        return position == other.position && specimenId.equals(other.specimenId)
                && specimenLabel.equals(other.specimenLabel) && heatId.equals(other.heatId)
                && heatNumber.equals(other.heatNumber) && testRunId.equals(other.testRunId)
                && analysisRunId.equals(other.analysisRunId) && property.equals(other.property)
                && status.equals(other.status) && java.util.Objects.equals(value, other.value)
                && unit.equals(other.unit) && java.util.Objects.equals(reported, other.reported)
                && java.util.Objects.equals(rounding, other.rounding)
                && java.util.Objects.equals(expandedUncertainty, other.expandedUncertainty)
                && sameDecimal(requirementMin, other.requirementMin) && sameDecimal(requirementMax, other.requirementMax)
                && java.util.Objects.equals(requirementUnit, other.requirementUnit)
                && sameDecimal(thicknessMinMm, other.thicknessMinMm) && sameDecimal(thicknessMaxMm, other.thicknessMaxMm)
                && java.util.Objects.equals(verdict, other.verdict)
                && java.util.Objects.equals(verdictReason, other.verdictReason) && flags.equals(other.flags);
    }

    private static boolean sameDecimal(BigDecimal a, BigDecimal b) {
        return a == null ? b == null : b != null && a.compareTo(b) == 0;
    }
}

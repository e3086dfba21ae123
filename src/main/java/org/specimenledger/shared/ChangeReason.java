package org.specimenledger.shared;

/** A change to a stored record must say why (ISO/IEC 17025 7.5, EU GMP Annex 11 §9). */
public final class ChangeReason {

    private ChangeReason() {
    }

    /** The trimmed reason, or a 422 naming {@code /reason} when it is missing. */
    public static String required(String reason) {
        if (reason == null || reason.isBlank()) {
            throw new RuleViolation("/reason", "a change to a stored record needs a reason");
        }
        return reason.trim();
    }
}

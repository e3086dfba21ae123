package org.specimenledger.testing;

import java.util.UUID;
import org.specimenledger.shared.DuplicateRecord;

/** The uploaded bytes are already the raw curve of another test run. 409, naming that run. */
class DuplicateCurve extends DuplicateRecord {

    private final UUID otherTestRunId;
    private final String sha256;

    DuplicateCurve(UUID otherTestRunId, String sha256, String message) {
        super("confirmDuplicate", message);
        this.otherTestRunId = otherTestRunId;
        this.sha256 = sha256;
    }

    UUID otherTestRunId() {
        return otherTestRunId;
    }

    String sha256() {
        return sha256;
    }
}

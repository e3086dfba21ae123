package org.specimenledger.testing;

/** Whether a test run counts. A specimen has at most one valid run; invalidating one needs a reason. */
public enum Validity {
    VALID,
    INVALID
}

package org.specimenledger.testing;

/**
 * The ISO 6892-1 test control methods [S: ISO 6892-1 method names; the rate ranges behind them are M]:
 * method A by strain rate, in closed loop on the extensometer (A1) or open loop, estimated from the
 * crosshead (A2); method B by stress rate in the elastic range.
 */
public enum ControlMethod {
    A1,
    A2,
    B;

    /** Whether the method A strain-rate ranges apply, so that rates outside them are flagged. */
    public boolean isStrainRateControlled() {
        return this != B;
    }
}

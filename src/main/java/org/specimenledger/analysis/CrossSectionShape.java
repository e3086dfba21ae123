package org.specimenledger.analysis;

/**
 * How S0 was obtained, which selects the sensitivity coefficients for its standard uncertainty
 * (formulas [CP, DOMAIN.md "Test pieces"]).
 */
public enum CrossSectionShape {
    /** u(S0) is given directly in mm². */
    DIRECT,
    /** Round bar, S0 = π d²/4: first dimension d; u(S0) = (π d / 2)·u(d). */
    ROUND,
    /** Flat piece, S0 = a·b: first dimension a (thickness), second b (width). */
    FLAT,
    /** Tube, S0 = π a (D − a): first dimension a (wall), second D (outer diameter). */
    TUBE
}

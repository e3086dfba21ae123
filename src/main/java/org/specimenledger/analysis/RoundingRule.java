package org.specimenledger.analysis;

/** Which rounding rule set turns a stored value into its reported string. */
public enum RoundingRule {
    /**
     * ISO 6892-1 test report rounding [M, DOMAIN.md]: strengths to 1 MPa, Ae to 0.1 %, other
     * elongations to 0.5 %, Z to 1 %.
     */
    ISO_6892_1,
    /**
     * ASTM practice [M, DOMAIN.md]: strength 1 MPa below 500 MPa, 5 MPa from 500 to 1000 MPa, 10 MPa
     * above; elongation and Z 0.5 % below 10 %, 1 % from 10 % up.
     */
    ASTM_PRACTICE
}

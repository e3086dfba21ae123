package org.specimenledger.analysis;

/** The kind of a reported quantity, which selects its rounding increment. */
public enum ReportedQuantity {
    /** ReH, ReL, Rp, Rt, Rm in MPa. */
    STRENGTH,
    /** E in MPa; rounded to 100 MPa (0.1 GPa) under both rule sets [CP, no rule in DOMAIN.md]. */
    MODULUS,
    /** Fm in N; rounded to 1 N under both rule sets [CP]. */
    FORCE,
    /** Ae in %. */
    YIELD_POINT_EXTENSION,
    /** Ag, Agt, A, At in %. */
    ELONGATION,
    /** Z in %. */
    REDUCTION_OF_AREA,
    /** W, Welastic and cyclic energies in J; four significant figures under both rule sets [CP]. */
    ENERGY
}

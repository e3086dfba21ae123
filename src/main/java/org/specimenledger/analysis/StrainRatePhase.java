package org.specimenledger.analysis;

/** Test phases whose strain rate ISO 6892-1 method A controls [M, DOMAIN.md]. */
public enum StrainRatePhase {
    /** Elastic range up to ReH or Rp (and Rt): range 2, 0.00025 s⁻¹ ± 20 % [M]. */
    ELASTIC,
    /** Yield range for ReL and Ae (discontinuous yielding only): range 2 or 3 [M]. */
    YIELD,
    /** From the end of yield (or Rp) to Fm, for Rm, Ag, A, Z: range 4, 0.0067 s⁻¹ ± 20 % [M]. */
    HARDENING
}

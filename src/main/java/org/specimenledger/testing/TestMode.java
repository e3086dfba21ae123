package org.specimenledger.testing;

/** What the run does to the piece, and so which engine analyses its curve. */
public enum TestMode {
    /** Monotonic pull to fracture: the tensile engine (ISO 6892-1 properties). */
    TENSILE,
    /** Loading–unloading cycles (e.g. an elastomer strip): the cyclic engine (loop energies). */
    CYCLIC
}

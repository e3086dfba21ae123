package org.specimenledger.equipment;

/** What an instrument is; each kind carries its own data and is classed by its own standard. */
public enum InstrumentKind {
    /** A frame with its force-measuring system; optionally names its built-in force transducers. */
    TESTING_MACHINE,
    /** A load cell with one or more force ranges, each classed per ISO 7500-1. */
    FORCE_TRANSDUCER,
    /** A strain-measuring device with a gauge length Le, classed per ISO 9513. */
    EXTENSOMETER
}

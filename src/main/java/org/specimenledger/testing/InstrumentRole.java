package org.specimenledger.testing;

import org.specimenledger.equipment.InstrumentKind;

/** The part an instrument plays in a test run, with the request field that names it. */
public enum InstrumentRole {
    TESTING_MACHINE("/machineId", InstrumentKind.TESTING_MACHINE, "testing machine"),
    FORCE_TRANSDUCER("/forceTransducerId", InstrumentKind.FORCE_TRANSDUCER, "force transducer"),
    EXTENSOMETER("/extensometerId", InstrumentKind.EXTENSOMETER, "extensometer");

    private final String pointer;
    private final InstrumentKind kind;
    private final String title;

    InstrumentRole(String pointer, InstrumentKind kind, String title) {
        this.pointer = pointer;
        this.kind = kind;
        this.title = title;
    }

    /** JSON Pointer of the registration field naming the instrument. */
    public String pointer() {
        return pointer;
    }

    /** The kind of instrument this role needs. */
    public InstrumentKind kind() {
        return kind;
    }

    public String title() {
        return title;
    }
}

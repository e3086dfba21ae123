package org.specimenledger.testing;

/** The standard a test run follows. Its requirements (classes, temperature) are in {@link StandardRequirements}. */
public enum TestStandard {
    /** ISO 6892-1, metallic materials at room temperature; names its control method (A1, A2 or B). */
    ISO_6892_1("ISO 6892-1"),
    /** ASTM E8, metallic materials, inch-pound specimens. */
    ASTM_E8("ASTM E8"),
    /** ASTM E8M, the metric companion of E8. */
    ASTM_E8M("ASTM E8M"),
    /** ISO 37, tensile stress–strain properties of vulcanised or thermoplastic rubber. */
    ISO_37("ISO 37"),
    /** Any other procedure, named in the run's {@code standardReference}. */
    OTHER("other procedure");

    private final String title;

    TestStandard(String title) {
        this.title = title;
    }

    /** How the standard is written in messages and reports. */
    public String title() {
        return title;
    }
}

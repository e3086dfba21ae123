package org.specimenledger.shared;

/** A record with the same natural key already exists. 409. */
public class DuplicateRecord extends RuntimeException {

    private final String pointer;

    public DuplicateRecord(String pointer, String message) {
        super(message);
        this.pointer = pointer;
    }

    /** JSON Pointer of the field that carries the duplicated key. */
    public String pointer() {
        return pointer;
    }
}

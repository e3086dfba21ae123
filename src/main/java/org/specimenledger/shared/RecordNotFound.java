package org.specimenledger.shared;

/** The addressed record does not exist (or, for a customer, belongs to another organisation). 404. */
public class RecordNotFound extends RuntimeException {

    private final String recordType;
    private final String id;

    public RecordNotFound(String recordType, Object id) {
        super("no " + recordType + " with id " + id);
        this.recordType = recordType;
        this.id = String.valueOf(id);
    }

    public String recordType() {
        return recordType;
    }

    public String id() {
        return id;
    }
}

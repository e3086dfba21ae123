package org.specimenledger.shared;

/** The request does not fit the record's current state (e.g. changing something already issued). 409. */
public class StateConflict extends RuntimeException {

    public StateConflict(String message) {
        super(message);
    }
}

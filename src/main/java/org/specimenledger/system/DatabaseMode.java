package org.specimenledger.system;

/** Which PostgreSQL this run uses: the one it started itself, or one named by configuration. */
public enum DatabaseMode {
    EMBEDDED,
    EXTERNAL
}

package org.specimenledger.testing;

/** A curve upload over the configured size limit, refused before (or as soon as) it passes the limit. 413. */
class CurveTooLarge extends RuntimeException {

    private final long limitBytes;

    CurveTooLarge(long announcedBytes, long limitBytes) {
        super(announcedBytes < 0 ? "the curve file is larger than the limit of " + limitBytes + " bytes"
                : "the curve file has " + announcedBytes + " bytes, above the limit of " + limitBytes + " bytes");
        this.limitBytes = limitBytes;
    }

    /** With a message of its own, e.g. for a batch of curve files. */
    CurveTooLarge(String message, long limitBytes) {
        super(message);
        this.limitBytes = limitBytes;
    }

    long limitBytes() {
        return limitBytes;
    }
}

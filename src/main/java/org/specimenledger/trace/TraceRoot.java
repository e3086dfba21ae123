package org.specimenledger.trace;

/**
 * Facts about the document at the root of a trace, supplied by the feature that issued it (certificates):
 * its number, the exact PDF bytes issued (optional, put into the bundle as {@code document.pdf}) and the
 * sequence number of the ledger event that recorded the issue, whose canonical text must contain the
 * PDF's SHA-256 in lower-case hex for the bundle's check to pass. Null fields are simply left out.
 */
public record TraceRoot(String documentNumber, byte[] documentPdf, Long issueEventSeq) {

    /** No document: the trace starts at the analysis runs themselves. */
    public static final TraceRoot NONE = new TraceRoot(null, null, null);
}

package org.specimenledger.testing;

import java.util.UUID;

/**
 * Where the bytes of raw curve files live. Today a PostgreSQL table ({@link DatabaseCurveContentStore});
 * the interface is the seam along which they can move to an S3-compatible object store (DESIGN.md, "Scale
 * path") while their descriptions stay in the database. Implementations store write-once: no update, no
 * delete.
 */
interface CurveContentStore {

    /**
     * Stores the bytes of a described curve, in the caller's transaction.
     *
     * @param rawCurveId the description's id, already stored
     * @param sha256     the SHA-256 of {@code content} as lower-case hex (the store may verify it)
     * @param content    the exact bytes as received; not modified
     */
    void put(UUID rawCurveId, String sha256, byte[] content);

    /**
     * The bytes exactly as stored.
     *
     * @throws IllegalStateException when the described curve has no content (a broken store)
     */
    byte[] get(UUID rawCurveId);
}

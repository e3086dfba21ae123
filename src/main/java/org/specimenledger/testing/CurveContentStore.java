package org.specimenledger.testing;

import java.util.UUID;

/**
 * Where the bytes of raw curve files live. Today a PostgreSQL table ({@link DatabaseCurveContentStore});
 * the interface is the seam along which they can move to an S3-compatible object store (DESIGN.md, "Scale
 * path") while their descriptions stay in the database. Implementations store write-once: no update, no
 * delete.
 *
 * <p>A write runs in the background, in the caller's transaction, while the caller reads the same bytes
 * (tens of megabytes take about as long to store as to parse); the caller must {@link Pending#await()} it
 * before it uses the transaction again, and it becomes durable only when that transaction commits.
 */
interface CurveContentStore {

    /** A write under way. */
    interface Pending {

        /** Waits for the write to end; rethrows its failure. */
        void await();

        /** Waits for the write to end, ignoring how: the transaction is being abandoned anyway. */
        void abandon();
    }

    /**
     * Starts storing the bytes of a curve in the caller's transaction; its description (same id, SHA-256 and
     * size) must be stored in the same transaction.
     *
     * @param rawCurveId the description's id
     * @param sha256     the SHA-256 of {@code content} as lower-case hex (the store may verify it)
     * @param content    the exact bytes as received; must not change until the write has ended
     */
    Pending put(UUID rawCurveId, String sha256, byte[] content);

    /**
     * The bytes exactly as stored.
     *
     * @throws IllegalStateException when the described curve has no content (a broken store)
     */
    byte[] get(UUID rawCurveId);

    /**
     * The SHA-256 (lower-case hex) of the bytes as stored now, computed by the store over its own copy, not taken
     * from the description: a read that only needs to know whether the bytes changed need not carry them over.
     *
     * @throws IllegalStateException when the described curve has no content (a broken store)
     */
    String sha256OfStored(UUID rawCurveId);
}

package org.specimenledger.audit;

import java.nio.charset.StandardCharsets;
import java.time.Instant;
import java.util.Base64;

/**
 * A signed checkpoint: the ledger's Merkle tree head (size and root) at one time, signed with the
 * laboratory's Ed25519 key. What is signed is {@link #signedText()}, four lines each ended by LF:
 * <pre>
 * specimen-ledger checkpoint v1
 * &lt;tree size, decimal&gt;
 * &lt;root hash, 64 lower-case hex digits&gt;
 * &lt;time, yyyy-MM-ddTHH:mm:ss.SSSSSSZ in UTC&gt;
 * </pre>
 * so that anyone can check it with the public key alone, e.g.
 * {@code openssl pkeyutl -verify -pubin -inkey key.pem -rawin -in text -sigfile sig.bin}.
 *
 * @param id         position in the list of checkpoints, from 1
 * @param treeSize   number of events covered: events 1..treeSize (leaf index = seq − 1)
 * @param rootHash   RFC 6962 root of those events' leaves, lower-case hex
 * @param reason     why it was recorded (schedule, certificate issue...); not signed
 * @param keyId      lower-case hex SHA-256 of the signing key's SubjectPublicKeyInfo DER
 * @param signature  the 64-byte Ed25519 signature of {@code signedText}, base64
 * @param signedText the exact signed text
 */
public record CheckpointView(long id, long treeSize, String rootHash, Instant recordedAt, String reason, String keyId,
        String signature, String signedText) {

    /** First line of every signed checkpoint text: names the format and its version. */
    public static final String HEADER = "specimen-ledger checkpoint v1";

    /** The text a checkpoint's signature covers (see the type's description). */
    public static String signedText(long treeSize, String rootHash, Instant recordedAt) {
        return HEADER + "\n" + treeSize + "\n" + rootHash + "\n" + CanonicalEvent.TIME.format(recordedAt) + "\n";
    }

    static CheckpointView of(long id, long treeSize, String rootHash, Instant recordedAt, String reason, String keyId,
            byte[] signature) {
        return new CheckpointView(id, treeSize, rootHash, recordedAt, reason, keyId,
                Base64.getEncoder().encodeToString(signature), signedText(treeSize, rootHash, recordedAt));
    }

    /** The signed bytes: {@link #signedText()} in UTF-8 (all ASCII). */
    public byte[] signedBytes() {
        return signedText.getBytes(StandardCharsets.UTF_8);
    }

    public byte[] signatureBytes() {
        return Base64.getDecoder().decode(signature);
    }
}

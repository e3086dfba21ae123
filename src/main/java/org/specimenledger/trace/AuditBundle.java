package org.specimenledger.trace;

import java.util.List;
import java.util.Map;
import java.util.UUID;
import org.specimenledger.audit.CheckpointView;
import org.specimenledger.audit.InclusionProof;
import org.specimenledger.audit.LedgerEvent;

/**
 * The contents of an audit bundle, read in one transaction and written out afterwards by
 * {@link AuditBundleWriter}.
 *
 * @param checkpoint the signed checkpoint covering every event in {@code events}
 * @param events     every event involved, in chain order, each with its inclusion proof against {@code checkpoint}
 * @param records    each record's latest state exactly as the ledger hashed it (the {@code after} of its latest event)
 * @param curves     raw curve bytes by raw curve id, exactly as uploaded
 */
public record AuditBundle(TraceView trace, TraceRoot root, CheckpointView checkpoint, String publicKeyPem,
        String keyId, List<ProvenEvent> events, List<Record> records, Map<UUID, byte[]> curves) {

    /** One event and its audit path. */
    public record ProvenEvent(LedgerEvent event, InclusionProof proof) {
    }

    /**
     * One record's state as recorded by event {@code seq}.
     *
     * @param json the {@code after} value cut from the canonical text, byte for byte
     */
    public record Record(String type, String id, long seq, String json) {
    }
}

package org.specimenledger.audit;

import static org.assertj.core.api.Assertions.assertThat;

import java.math.BigDecimal;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.UUID;
import org.junit.jupiter.api.AfterEach;
import org.junit.jupiter.api.Test;
import org.specimenledger.testsupport.IntegrationTest;
import org.specimenledger.testsupport.TestAccounts;
import org.springframework.beans.factory.annotation.Autowired;
import org.springframework.jdbc.core.JdbcTemplate;
import org.springframework.transaction.support.TransactionTemplate;
import tools.jackson.databind.JsonNode;

/**
 * Tampering done the way a database superuser could: the append-only triggers switched off, rows
 * changed in place. The chain verifier must name the exact first event that does not verify, and why;
 * after the original rows are put back it must verify again. The database is shared with every other
 * test, so each change is undone in {@code finally}.
 */
class LedgerTamperingTest extends IntegrationTest {

    @Autowired
    JdbcTemplate jdbc;
    @Autowired
    Ledger ledger;
    @Autowired
    TransactionTemplate transactions;

    private final String saved = "tamper_saved_" + UUID.randomUUID().toString().replace("-", "");

    /** Records one event with the given after-value, as any feature would, and returns its sequence number. */
    private long event(Object after) {
        return transactions.execute(status -> ledger.record("sample.recorded", "sample", UUID.randomUUID(), null,
                null, after)).seq();
    }

    private long oldEventWithSuccessors() {
        Map<String, Object> after = new LinkedHashMap<>();
        after.put("label", "Tamper probe " + UUID.randomUUID());
        after.put("rmMpa", new BigDecimal("512.50"));
        after.put("readings", List.of(1, 2, 3));
        long seq = event(after);
        event(Map.of("label", "successor one"));
        event(Map.of("label", "successor two"));
        return seq;
    }

    private JsonNode verify() {
        return as(TestAccounts.AUDITOR).get("/api/v1/audit/verify").json();
    }

    private void assertBroken(long seq, String problem, String detailPart) {
        JsonNode v = verify();
        assertThat(v.get("valid").asBoolean()).as(v.toString()).isFalse();
        assertThat(v.get("firstBrokenSeq").asLong()).as(v.toString()).isEqualTo(seq);
        assertThat(v.get("problem").asString()).as(v.toString()).isEqualTo(problem);
        assertThat(v.get("detail").asString()).contains(detailPart);
        assertThat(v.get("eventsChecked").asLong()).isEqualTo(seq - 1);
    }

    /** Keeps a copy of the rows about to be changed, then switches the guards off. */
    private void save(long... seqs) {
        StringBuilder in = new StringBuilder();
        for (long s : seqs) {
            in.append(in.isEmpty() ? "" : ",").append(s);
        }
        jdbc.execute("CREATE TABLE " + saved + " AS SELECT * FROM audit_event WHERE seq IN (" + in + ")");
        jdbc.execute("CREATE TABLE " + saved + "_leaf AS SELECT * FROM ledger_tree_node WHERE level = 0"
                + " AND position IN (SELECT seq - 1 FROM " + saved + ")");
        jdbc.execute("ALTER TABLE audit_event DISABLE TRIGGER audit_event_no_update");
        jdbc.execute("ALTER TABLE ledger_tree_node DISABLE TRIGGER ledger_tree_node_no_update");
    }

    /** Puts the saved rows back exactly and the guards on again; runs after every test, failed or not. */
    @AfterEach
    void restore() {
        Boolean exists = jdbc.queryForObject("SELECT to_regclass(?) IS NOT NULL", Boolean.class, saved);
        if (Boolean.TRUE.equals(exists)) {
            try {
                jdbc.update("DELETE FROM audit_event WHERE seq IN (SELECT seq FROM " + saved + ")");
                jdbc.update("DELETE FROM audit_event WHERE seq >= 1000000000000");
                jdbc.update("INSERT INTO audit_event SELECT * FROM " + saved);
                jdbc.update("DELETE FROM ledger_tree_node WHERE level = 0 AND position IN (SELECT position FROM "
                        + saved + "_leaf)");
                jdbc.update("INSERT INTO ledger_tree_node SELECT * FROM " + saved + "_leaf");
            } finally {
                jdbc.execute("ALTER TABLE audit_event ENABLE TRIGGER audit_event_no_update");
                jdbc.execute("ALTER TABLE ledger_tree_node ENABLE TRIGGER ledger_tree_node_no_update");
                jdbc.execute("DROP TABLE " + saved);
                jdbc.execute("DROP TABLE " + saved + "_leaf");
            }
            JsonNode v = verify();
            assertThat(v.get("valid").asBoolean()).as("restored ledger verifies again: " + v).isTrue();
        }
    }

    @Test
    void aChangedJsonbValueWithoutRehashIsAColumnMismatchAtThatEvent() {
        long seq = oldEventWithSuccessors();
        save(seq);
        jdbc.update("UPDATE audit_event SET after_state = jsonb_set(after_state, '{rmMpa}', '498.0') WHERE seq = ?",
                seq);
        assertBroken(seq, "column-mismatch", "after_state");
    }

    @Test
    void aChangedPlainColumnWithoutRehashIsAColumnMismatchAtThatEvent() {
        long seq = oldEventWithSuccessors();
        save(seq);
        jdbc.update("UPDATE audit_event SET actor = 'someone-else' WHERE seq = ?", seq);
        assertBroken(seq, "column-mismatch", "column actor");
    }

    @Test
    void aChangedTimeColumnIsAColumnMismatch() {
        long seq = oldEventWithSuccessors();
        save(seq);
        jdbc.update("UPDATE audit_event SET occurred_at = occurred_at - interval '1 day' WHERE seq = ?", seq);
        assertBroken(seq, "column-mismatch", "occurred_at");
    }

    /** jsonb keeps 512.50 as written; 512.5 and 5.125E2 are the same number, so still valid (compared by value). */
    @Test
    void numbersInJsonbColumnsAreComparedByValue() {
        long seq = oldEventWithSuccessors();
        save(seq);
        jdbc.update("UPDATE audit_event SET after_state = jsonb_set(after_state, '{rmMpa}', '5.125E2') WHERE seq = ?",
                seq);
        assertThat(jdbc.queryForObject("SELECT after_state->>'rmMpa' FROM audit_event WHERE seq = ?", String.class,
                seq)).isEqualTo("512.5");
        JsonNode v = verify();
        assertThat(v.get("valid").asBoolean()).as(v.toString()).isTrue();
        // ... and a key order or spacing of the jsonb text is no difference either; a changed list is
        jdbc.update("UPDATE audit_event SET after_state = jsonb_set(after_state, '{readings}', '[1, 2, 4]') WHERE seq = ?",
                seq);
        assertBroken(seq, "column-mismatch", "after_state");
    }

    @Test
    void aChangedCanonicalTextIsAHashMismatchAtThatEvent() {
        long seq = oldEventWithSuccessors();
        save(seq);
        jdbc.update("UPDATE audit_event SET canonical = replace(canonical, '512.50', '498.00') WHERE seq = ?", seq);
        assertBroken(seq, "hash-mismatch", "SHA-256 of event " + seq);
    }

    @Test
    void aDeletedEventIsAMissingSequenceAtItsNumber() {
        long seq = oldEventWithSuccessors();
        save(seq);
        jdbc.update("DELETE FROM audit_event WHERE seq = ?", seq);
        assertBroken(seq, "missing-sequence", "expected event " + seq);
    }

    @Test
    void aDeletedLastEventIsCaughtByTheChainHead() {
        long seq = event(Map.of("label", "last one"));
        save(seq);
        jdbc.update("DELETE FROM audit_event WHERE seq = (SELECT max(seq) FROM audit_event)");
        assertBroken(seq, "missing-sequence", "chain head records " + seq);
    }

    @Test
    void twoSwappedEventsBreakTheLinkAtTheFirstPosition() {
        long a = oldEventWithSuccessors();
        long b = a + 2;
        save(a, b);
        jdbc.update("UPDATE audit_event SET seq = 1000000000000 WHERE seq = ?", a);
        jdbc.update("UPDATE audit_event SET seq = ? WHERE seq = ?", a, b);
        jdbc.update("UPDATE audit_event SET seq = ? WHERE seq = 1000000000000", b);
        assertBroken(a, "broken-link", "stored at position " + a + " is that of event " + b);
    }

    /** Re-hashed consistently, but the leaf recorded in the Merkle tree at append time still tells. */
    @Test
    void anEventRehashedWithoutItsSuccessorsIsNamedThroughItsMerkleLeaf() {
        long seq = oldEventWithSuccessors();
        save(seq);
        rewriteAndRehash(seq);
        assertBroken(seq, "hash-mismatch", "Merkle leaf recorded when it was appended");
    }

    /** Leaf rewritten too: the successor, still intact, was chained to the old hash and names the culprit. */
    @Test
    void anEventRehashedWithItsLeafIsNamedThroughItsSuccessorsLink() {
        long seq = oldEventWithSuccessors();
        save(seq);
        String canonical = rewriteAndRehash(seq);
        jdbc.update("UPDATE ledger_tree_node SET hash = ? WHERE level = 0 AND position = ?",
                MerkleTree.leafHash(canonical), seq - 1);
        assertBroken(seq, "broken-link", "event " + (seq + 1) + " was chained to event " + seq);
    }

    /** The same value changed in the canonical text and in the column, and the hash recomputed. */
    private String rewriteAndRehash(long seq) {
        String canonical = jdbc.queryForObject("SELECT canonical FROM audit_event WHERE seq = ?", String.class, seq)
                .replace("512.50", "498.00");
        jdbc.update("UPDATE audit_event SET canonical = ?, hash = ?, "
                + "after_state = jsonb_set(after_state, '{rmMpa}', '498.00') WHERE seq = ?", canonical,
                Sha256.hex(canonical), seq);
        return canonical;
    }
}

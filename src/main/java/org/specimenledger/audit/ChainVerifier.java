package org.specimenledger.audit;

import java.sql.ResultSet;
import java.sql.SQLException;
import javax.sql.DataSource;
import org.springframework.jdbc.core.JdbcTemplate;
import org.springframework.jdbc.core.RowCallbackHandler;
import org.springframework.stereotype.Service;
import org.springframework.transaction.annotation.Transactional;

/**
 * Recomputes the whole chain from the stored canonical texts, streaming rows (PostgreSQL only streams
 * with a fetch size inside a transaction), so memory stays flat however long the ledger is.
 */
@Service
public class ChainVerifier {

    private final JdbcTemplate jdbc;

    ChainVerifier(DataSource dataSource) {
        this.jdbc = new JdbcTemplate(dataSource);
        this.jdbc.setFetchSize(1000);
    }

    @Transactional(readOnly = true)
    public ChainVerification verify() {
        Walk walk = new Walk();
        jdbc.query("SELECT seq, previous_hash, hash, canonical FROM audit_event ORDER BY seq", walk);
        return walk.result();
    }

    /** Checks each row against the one before it; stops looking once the first break is found. */
    private static final class Walk implements RowCallbackHandler {
        private long expectedSeq = 1;
        private String previousHash = CanonicalEvent.GENESIS_HASH;
        private long checked;
        private ChainVerification broken;

        @Override
        public void processRow(ResultSet rs) throws SQLException {
            if (broken != null) {
                return;
            }
            long seq = rs.getLong(1);
            String storedPrevious = rs.getString(2);
            String hash = rs.getString(3);
            String canonical = rs.getString(4);
            if (seq != expectedSeq) {
                broken = ChainVerification.broken(checked, expectedSeq, "missing-sequence",
                        "expected event " + expectedSeq + " but the next stored event is " + seq);
                return;
            }
            if (!previousHash.equals(storedPrevious) || !CanonicalEvent.links(canonical, seq, previousHash)) {
                broken = ChainVerification.broken(checked, seq, "broken-link",
                        "event " + seq + " does not name the hash of event " + (seq - 1));
                return;
            }
            String recomputed = Sha256.hex(canonical);
            if (!recomputed.equals(hash)) {
                broken = ChainVerification.broken(checked, seq, "hash-mismatch",
                        "SHA-256 of event " + seq + " is " + recomputed + ", stored " + hash);
                return;
            }
            previousHash = hash;
            expectedSeq++;
            checked++;
        }

        ChainVerification result() {
            return broken != null ? broken : ChainVerification.ok(checked, previousHash);
        }
    }
}

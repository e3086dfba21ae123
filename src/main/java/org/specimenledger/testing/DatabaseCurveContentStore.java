package org.specimenledger.testing;

import java.util.UUID;
import org.springframework.jdbc.core.simple.JdbcClient;
import org.springframework.stereotype.Component;
import org.springframework.transaction.annotation.Propagation;
import org.springframework.transaction.annotation.Transactional;

/**
 * Raw curve bytes in PostgreSQL ({@code raw_curve_content}, {@code bytea} stored uncompressed). The
 * database checks the SHA-256 and size against the description and refuses any UPDATE or DELETE.
 */
@Component
class DatabaseCurveContentStore implements CurveContentStore {

    private final JdbcClient jdbc;

    DatabaseCurveContentStore(JdbcClient jdbc) {
        this.jdbc = jdbc;
    }

    @Override
    @Transactional(propagation = Propagation.MANDATORY)
    public void put(UUID rawCurveId, String sha256, byte[] content) {
        jdbc.sql("INSERT INTO raw_curve_content (raw_curve_id, sha256, size_bytes, content) VALUES (?, ?, ?, ?)")
                .params(rawCurveId, sha256, (long) content.length, content)
                .update();
    }

    @Override
    @Transactional(readOnly = true)
    public byte[] get(UUID rawCurveId) {
        return jdbc.sql("SELECT content FROM raw_curve_content WHERE raw_curve_id = ?")
                .param(rawCurveId)
                .query((rs, n) -> rs.getBytes(1))
                .optional()
                .orElseThrow(() -> new IllegalStateException("raw curve " + rawCurveId + " has no stored content"));
    }
}

package org.specimenledger.testing;

import jakarta.annotation.PreDestroy;
import java.sql.Connection;
import java.sql.PreparedStatement;
import java.sql.SQLException;
import java.util.UUID;
import java.util.concurrent.ExecutionException;
import java.util.concurrent.ExecutorService;
import java.util.concurrent.Executors;
import java.util.concurrent.Future;
import java.util.concurrent.atomic.AtomicInteger;
import javax.sql.DataSource;
import org.springframework.jdbc.datasource.DataSourceUtils;
import org.springframework.jdbc.support.SQLStateSQLExceptionTranslator;
import org.springframework.jdbc.core.simple.JdbcClient;
import org.springframework.stereotype.Component;
import org.springframework.transaction.annotation.Transactional;
import org.springframework.transaction.support.TransactionSynchronizationManager;

/**
 * Raw curve bytes in PostgreSQL ({@code raw_curve_content}, {@code bytea} stored uncompressed). The
 * database checks the SHA-256 and size against the description and refuses any UPDATE or DELETE.
 *
 * <p>The INSERT runs on a worker thread over the caller's own transactional connection, which the caller
 * leaves alone until {@link Pending#await()}: one connection, used by one thread at a time, so the bytes
 * and their description commit or roll back together.
 */
@Component
class DatabaseCurveContentStore implements CurveContentStore {

    private static final String INSERT =
            "INSERT INTO raw_curve_content (raw_curve_id, sha256, size_bytes, content) VALUES (?, ?, ?, ?)";

    private final DataSource dataSource;
    private final JdbcClient jdbc;
    private final ExecutorService writers;

    DatabaseCurveContentStore(DataSource dataSource, JdbcClient jdbc) {
        this.dataSource = dataSource;
        this.jdbc = jdbc;
        AtomicInteger n = new AtomicInteger();
        this.writers = Executors.newCachedThreadPool(r -> {
            Thread t = new Thread(r, "curve-store-" + n.incrementAndGet());
            t.setDaemon(true);
            return t;
        });
    }

    @Override
    public Pending put(UUID rawCurveId, String sha256, byte[] content) {
        if (!TransactionSynchronizationManager.isActualTransactionActive()) {
            throw new IllegalStateException("curve content is stored only inside the transaction of its description");
        }
        Connection connection = DataSourceUtils.getConnection(dataSource);
        Future<?> write = writers.submit(() -> {
            try (PreparedStatement insert = connection.prepareStatement(INSERT)) {
                insert.setObject(1, rawCurveId);
                insert.setString(2, sha256);
                insert.setLong(3, content.length);
                insert.setBytes(4, content);
                insert.executeUpdate();
            }
            return null;
        });
        return new Pending() {
            @Override
            public void await() {
                try {
                    write.get();
                } catch (InterruptedException e) {
                    Thread.currentThread().interrupt();
                    throw new IllegalStateException("interrupted while storing raw curve " + rawCurveId, e);
                } catch (ExecutionException e) {
                    if (e.getCause() instanceof SQLException sql) {
                        throw new SQLStateSQLExceptionTranslator().translate("store raw curve", INSERT, sql);
                    }
                    throw new IllegalStateException("storing raw curve " + rawCurveId + " failed", e.getCause());
                }
            }

            @Override
            public void abandon() {
                try {
                    write.get();
                } catch (InterruptedException e) {
                    Thread.currentThread().interrupt();
                } catch (ExecutionException ignored) {
                    // the caller is failing for a reason of its own and rolls the transaction back
                }
            }
        };
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

    /** PostgreSQL hashes the stored value itself ({@code sha256(bytea)}, built in since version 11). */
    @Override
    @Transactional(readOnly = true)
    public String sha256OfStored(UUID rawCurveId) {
        return jdbc.sql("SELECT encode(sha256(content), 'hex') FROM raw_curve_content WHERE raw_curve_id = ?")
                .param(rawCurveId)
                .query((rs, n) -> rs.getString(1))
                .optional()
                .orElseThrow(() -> new IllegalStateException("raw curve " + rawCurveId + " has no stored content"));
    }

    @PreDestroy
    void stop() {
        writers.shutdown();
    }
}

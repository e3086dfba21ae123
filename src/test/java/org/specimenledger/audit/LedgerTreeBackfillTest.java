package org.specimenledger.audit;

import static org.assertj.core.api.Assertions.assertThat;

import java.sql.Connection;
import java.sql.DriverManager;
import java.util.ArrayList;
import java.util.HexFormat;
import java.util.List;
import org.flywaydb.core.Flyway;
import org.junit.jupiter.api.Test;
import org.postgresql.ds.PGSimpleDataSource;
import org.specimenledger.testsupport.TestDatabase;
import org.springframework.jdbc.core.simple.JdbcClient;

/**
 * Migration V20 gives events that were recorded before it their Merkle leaves and subtrees (in SQL),
 * and those equal what the Java tree computes from the canonical texts, and what {@link GeneratedChain}
 * writes for the benchmark. Runs on two scratch databases next to the test database.
 */
class LedgerTreeBackfillTest {

    private static final int EVENTS = 300;

    @Test
    void migrationBackfillsTheSameTreeTheServiceWouldHaveWritten() throws Exception {
        String base = TestDatabase.url();
        String name = "ledger_backfill_" + Long.toHexString(System.nanoTime());
        String backfilled = create(base, name + "_a");
        String generated = create(base, name + "_b");
        try {
            PGSimpleDataSource old = dataSource(backfilled);
            Flyway.configure().dataSource(old).locations("classpath:db/migration").target("6").load().migrate();
            GeneratedChain.write(old, EVENTS, false);
            Flyway.configure().dataSource(old).locations("classpath:db/migration").load().migrate();

            JdbcClient a = JdbcClient.create(old);
            List<String> canonical = a.sql("SELECT canonical FROM audit_event ORDER BY seq").query(String.class).list();
            assertThat(canonical).hasSize(EVENTS);
            List<String> expected = new ArrayList<>();
            MerkleTree.Frontier frontier = new MerkleTree.Frontier();
            for (String text : canonical) {
                frontier.append(MerkleTree.leafHash(text),
                        (level, position, hash) -> expected.add(level + "/" + position + "/" + HexFormat.of().formatHex(hash)));
            }
            assertThat(nodes(a)).containsExactlyInAnyOrderElementsOf(expected);
            assertThat(LedgerTree.over(old).root(EVENTS)).isEqualTo(frontier.root());
            ChainVerification v = ChainVerifier.over(old).verify();
            assertThat(v.valid()).as(v.toString()).isTrue();
            assertThat(v.eventsChecked()).isEqualTo(EVENTS);

            PGSimpleDataSource fresh = dataSource(generated);
            Flyway.configure().dataSource(fresh).locations("classpath:db/migration").load().migrate();
            GeneratedChain.write(fresh, EVENTS, true);
            assertThat(nodes(JdbcClient.create(fresh))).containsExactlyInAnyOrderElementsOf(expected);
            assertThat(ChainVerifier.over(fresh).verify().valid()).isTrue();
        } finally {
            drop(base, name + "_a");
            drop(base, name + "_b");
        }
    }

    private static List<String> nodes(JdbcClient db) {
        return db.sql("SELECT level, position, hash FROM ledger_tree_node")
                .query((rs, n) -> rs.getInt(1) + "/" + rs.getLong(2) + "/" + HexFormat.of().formatHex(rs.getBytes(3)))
                .list();
    }

    private static PGSimpleDataSource dataSource(String url) {
        PGSimpleDataSource ds = new PGSimpleDataSource();
        ds.setURL(url);
        return ds;
    }

    private static String create(String base, String database) throws Exception {
        execute(base, "CREATE DATABASE " + database + " ENCODING 'UTF8'");
        return base.replaceFirst("/[^/?]+(\\?|$)", "/" + database + "$1");
    }

    private static void drop(String base, String database) throws Exception {
        execute(base, "DROP DATABASE IF EXISTS " + database + " WITH (FORCE)");
    }

    private static void execute(String url, String sql) throws Exception {
        try (Connection c = DriverManager.getConnection(url); var s = c.createStatement()) {
            s.execute(sql);
        }
    }
}

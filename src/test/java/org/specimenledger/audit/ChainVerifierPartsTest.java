package org.specimenledger.audit;

import static org.assertj.core.api.Assertions.assertThat;

import java.sql.Connection;
import java.sql.DriverManager;
import java.util.function.Consumer;
import org.flywaydb.core.Flyway;
import org.junit.jupiter.api.AfterAll;
import org.junit.jupiter.api.BeforeAll;
import org.junit.jupiter.api.Test;
import org.postgresql.ds.PGSimpleDataSource;
import org.specimenledger.testsupport.TestDatabase;
import org.springframework.jdbc.core.JdbcTemplate;

/**
 * A chain cut into ranges checked at once must report exactly what one walk from the first event
 * reports, also when the damage sits at or across a cut. A scratch database of 300 generated events,
 * cut in three (ranges 1–100, 101–200, 201–), damaged and compared with the single walk, then repaired.
 */
class ChainVerifierPartsTest {

    private static final int EVENTS = 300;
    private static String base;
    private static String name;
    private static PGSimpleDataSource db;
    private static JdbcTemplate jdbc;

    @BeforeAll
    static void generate() throws Exception {
        base = TestDatabase.url();
        name = "ledger_parts_" + Long.toHexString(System.nanoTime());
        execute(base, "CREATE DATABASE " + name + " ENCODING 'UTF8'");
        db = new PGSimpleDataSource();
        db.setURL(base.replaceFirst("/[^/?]+(\\?|$)", "/" + name + "$1"));
        Flyway.configure().dataSource(db).locations("classpath:db/migration").load().migrate();
        GeneratedChain.write(db, EVENTS, true);
        jdbc = new JdbcTemplate(db);
        jdbc.execute("ALTER TABLE audit_event DISABLE TRIGGER audit_event_no_update");
        jdbc.execute("ALTER TABLE ledger_tree_node DISABLE TRIGGER ledger_tree_node_no_update");
        jdbc.execute("CREATE TABLE original AS SELECT * FROM audit_event");
        jdbc.execute("CREATE TABLE original_leaf AS SELECT * FROM ledger_tree_node WHERE level = 0");
    }

    @AfterAll
    static void drop() throws Exception {
        execute(base, "DROP DATABASE IF EXISTS " + name + " WITH (FORCE)");
    }

    private static ChainVerification single() {
        return new ChainVerifier(db, Long.MAX_VALUE, 1).verify();
    }

    private static ChainVerification inThree() {
        return new ChainVerifier(db, 1, 3).verify();
    }

    /** Damages the scratch ledger, compares both ways of walking it, and puts it back. */
    private static ChainVerification damaged(Consumer<JdbcTemplate> damage) {
        try {
            damage.accept(jdbc);
            ChainVerification one = single();
            assertThat(inThree()).isEqualTo(one);
            return one;
        } finally {
            jdbc.update("DELETE FROM audit_event");
            jdbc.update("INSERT INTO audit_event SELECT * FROM original");
            jdbc.update("DELETE FROM ledger_tree_node WHERE level = 0");
            jdbc.update("INSERT INTO ledger_tree_node SELECT * FROM original_leaf");
            jdbc.update("UPDATE audit_chain_head SET last_seq = (SELECT max(seq) FROM original),"
                    + " last_hash = (SELECT hash FROM original WHERE seq = (SELECT max(seq) FROM original))");
        }
    }

    @Test
    void anIntactChainVerifiesTheSameBothWays() {
        ChainVerification one = single();
        assertThat(one.valid()).isTrue();
        assertThat(one.eventsChecked()).isEqualTo(EVENTS);
        assertThat(inThree()).isEqualTo(one);
    }

    @Test
    void missingEventsAtAndAroundTheCuts() {
        for (long seq : new long[] {1, 99, 100, 101, 102, 200, 201, 300}) {
            ChainVerification v = damaged(j -> j.update("DELETE FROM audit_event WHERE seq = ?", seq));
            assertThat(v.firstBrokenSeq()).as("deleted %d", seq).isEqualTo(seq);
            assertThat(v.problem()).isEqualTo("missing-sequence");
        }
        ChainVerification wholeRange = damaged(j -> j.update("DELETE FROM audit_event WHERE seq BETWEEN 101 AND 200"));
        assertThat(wholeRange.firstBrokenSeq()).isEqualTo(101);
    }

    @Test
    void eventsRehashedWithTheirLeafJustBeforeACutAreNamed() {
        for (long seq : new long[] {99, 100, 101, 200}) {
            ChainVerification v = damaged(j -> {
                String canonical = j.queryForObject("SELECT canonical FROM audit_event WHERE seq = ?", String.class, seq)
                        .replace("Bench item", "Bench iten");
                j.update("UPDATE audit_event SET canonical = ?, hash = ?, after_state = jsonb_set(after_state, '{label}',"
                        + " to_jsonb(replace(after_state->>'label', 'Bench item', 'Bench iten'))),"
                        + " before_state = CASE WHEN before_state IS NULL THEN NULL ELSE jsonb_set(before_state,"
                        + " '{label}', to_jsonb(replace(before_state->>'label', 'Bench item', 'Bench iten'))) END"
                        + " WHERE seq = ?", canonical, Sha256.hex(canonical), seq);
                j.update("UPDATE ledger_tree_node SET hash = ? WHERE level = 0 AND position = ?",
                        MerkleTree.leafHash(canonical), seq - 1);
            });
            assertThat(v.firstBrokenSeq()).as("re-hashed %d", seq).isEqualTo(seq);
            assertThat(v.problem()).as(v.toString()).isEqualTo("broken-link");
        }
    }

    @Test
    void columnChangesAndSwapsAcrossACut() {
        ChainVerification column = damaged(j -> j.update("UPDATE audit_event SET actor = 'x' WHERE seq = 101"));
        assertThat(column.firstBrokenSeq()).isEqualTo(101);
        assertThat(column.problem()).isEqualTo("column-mismatch");
        ChainVerification swap = damaged(j -> {
            j.update("UPDATE audit_event SET seq = 1000000000000 WHERE seq = 100");
            j.update("UPDATE audit_event SET seq = 100 WHERE seq = 101");
            j.update("UPDATE audit_event SET seq = 101 WHERE seq = 1000000000000");
        });
        assertThat(swap.firstBrokenSeq()).isEqualTo(100);
        assertThat(swap.problem()).isEqualTo("broken-link");
        ChainVerification twoBreaks = damaged(j -> {
            j.update("UPDATE audit_event SET actor = 'x' WHERE seq = 250");
            j.update("UPDATE audit_event SET reason = 'y' WHERE seq = 150");
        });
        assertThat(twoBreaks.firstBrokenSeq()).isEqualTo(150);
        assertThat(twoBreaks.eventsChecked()).isEqualTo(149);
    }

    private static void execute(String url, String sql) throws Exception {
        try (Connection c = DriverManager.getConnection(url); var s = c.createStatement()) {
            s.execute(sql);
        }
    }
}

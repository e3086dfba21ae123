package org.specimenledger.audit;

import static org.assertj.core.api.Assertions.assertThat;
import static org.junit.jupiter.api.Assumptions.assumeTrue;

import java.nio.file.Path;
import java.security.PublicKey;
import java.util.HexFormat;
import java.util.List;
import java.util.Map;
import java.util.UUID;
import java.util.regex.Matcher;
import java.util.regex.Pattern;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.postgresql.ds.PGSimpleDataSource;
import org.specimenledger.testsupport.IntegrationTest;
import org.specimenledger.testsupport.TestAccounts;
import org.specimenledger.testsupport.TestDatabase;
import org.springframework.beans.factory.annotation.Autowired;
import org.springframework.jdbc.core.JdbcTemplate;
import org.springframework.jdbc.core.simple.JdbcClient;

/**
 * A backup made with PostgreSQL's own client tools ({@code pg_dump -Fc}, {@code pg_restore}) restores
 * into a new database where the chain still verifies, the Merkle tree still gives the signed roots, and
 * every old checkpoint signature still holds with the key the service publishes.
 */
class LedgerBackupTest extends IntegrationTest {

    private static final HexFormat HEX = HexFormat.of();

    @Autowired
    JdbcTemplate jdbc;
    @Autowired
    Checkpoints checkpoints;

    @Test
    void dumpAndRestoreKeepTheChainTheTreeAndTheCheckpointSignatures(@TempDir Path dir) throws Exception {
        assumeTrue(LedgerProofsApiTest.onPath("pg_dump", "--version") && LedgerProofsApiTest.onPath("pg_restore", "--version"),
                "pg_dump / pg_restore not on the PATH: skipping the backup and restore test");
        int serverMajor = jdbc.queryForObject("SELECT current_setting('server_version_num')::int / 10000", Integer.class);
        int toolMajor = major(LedgerProofsApiTest.run("pg_dump", "--version").output());
        assumeTrue(toolMajor >= serverMajor, "pg_dump " + toolMajor + " cannot dump a PostgreSQL " + serverMajor
                + " server: skipping the backup and restore test");

        as(TestAccounts.MANAGER).post("/api/v1/customers", Map.of("name", "Backup Forge " + UUID.randomUUID(),
                "address", "Vault Row 1"));
        CheckpointView first = checkpoints.record("test: before backup, first");
        as(TestAccounts.MANAGER).post("/api/v1/customers", Map.of("name", "Backup Forge " + UUID.randomUUID(),
                "address", "Vault Row 2"));
        CheckpointView second = checkpoints.record("test: before backup, second");

        String sourceJdbc = TestDatabase.url();
        String source = jdbc.queryForObject("SELECT current_database()", String.class);
        String target = source + "_restored";
        String targetJdbc = sourceJdbc.replace("/" + source, "/" + target);
        Path dump = dir.resolve("ledger.dump");
        jdbc.execute("CREATE DATABASE " + target + " ENCODING 'UTF8'");
        try {
            var dumped = LedgerProofsApiTest.run("pg_dump", "--format=custom", "--file=" + dump,
                    "--dbname=" + libpq(sourceJdbc));
            assertThat(dumped.exit()).as(dumped.output()).isZero();
            var restored = LedgerProofsApiTest.run("pg_restore", "--no-owner", "--exit-on-error",
                    "--dbname=" + libpq(targetJdbc), dump.toString());
            assertThat(restored.exit()).as(restored.output()).isZero();

            PGSimpleDataSource copy = new PGSimpleDataSource();
            copy.setURL(targetJdbc);
            ChainVerification verification = ChainVerifier.over(copy).verify();
            assertThat(verification.valid()).as(verification.toString()).isTrue();
            JdbcClient restoredDb = JdbcClient.create(copy);
            assertThat(verification.eventsChecked()).isEqualTo(restoredDb
                    .sql("SELECT count(*) FROM audit_event").query(Long.class).single())
                    .isGreaterThanOrEqualTo(second.treeSize());

            PublicKey key = LedgerSigningKey.readPublicKey(anonymous().get("/api/v1/ledger/key").json()
                    .get("publicKeyPem").asString());
            List<CheckpointView> kept = restoredDb.sql("SELECT id, tree_size, root_hash, recorded_at, reason, key_id,"
                    + " signature FROM ledger_checkpoint ORDER BY id").query(Checkpoints::row).list();
            assertThat(kept).extracting(CheckpointView::id).contains(first.id(), second.id());
            LedgerTree tree = LedgerTree.over(copy);
            for (CheckpointView c : kept) {
                assertThat(LedgerSigningKey.verify(key, c.signedBytes(), c.signatureBytes())).as("checkpoint %d", c.id())
                        .isTrue();
                assertThat(HEX.formatHex(tree.root(c.treeSize()))).as("root of checkpoint %d", c.id())
                        .isEqualTo(c.rootHash());
            }
            assertThat(kept.stream().filter(c -> c.id() == second.id()).findFirst().orElseThrow())
                    .isEqualTo(second);
        } finally {
            jdbc.execute("DROP DATABASE IF EXISTS " + target + " WITH (FORCE)");
        }
    }

    /** A JDBC URL such as {@code jdbc:postgresql://host:5432/db?user=u} as a libpq URI (same parameters). */
    private static String libpq(String jdbcUrl) {
        return jdbcUrl.substring("jdbc:".length());
    }

    private static int major(String version) {
        Matcher m = Pattern.compile("(\\d+)(\\.\\d+)?").matcher(version);
        return m.find() ? Integer.parseInt(m.group(1)) : 0;
    }
}

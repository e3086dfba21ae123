package org.specimenledger.system;

import static org.assertj.core.api.Assertions.assertThat;

import java.io.BufferedReader;
import java.io.InputStreamReader;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.sql.Connection;
import java.sql.DriverManager;
import java.util.concurrent.TimeUnit;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

/**
 * The default mode's database: the embedded PostgreSQL starts as whoever runs the service (root in CI
 * and in containers), keeps its data across restarts, and recovers from a run that was killed.
 */
class EmbeddedPostgresServerTest {

    @TempDir
    Path dir;

    @Test
    void startsAsTheCurrentUserAndKeepsDataAcrossRestarts() throws Exception {
        Path data = dir.resolve("pgdata");
        try (EmbeddedPostgresServer server = EmbeddedPostgresServer.start(data, 0)) {
            try (Connection c = DriverManager.getConnection(server.jdbcUrl()); var s = c.createStatement()) {
                s.execute("CREATE TABLE kept (v text)");
                s.execute("INSERT INTO kept VALUES ('survives a restart')");
                var rs = s.executeQuery("SELECT current_user, version()");
                rs.next();
                System.out.println("embedded PostgreSQL started by OS user " + System.getProperty("user.name")
                        + ": " + rs.getString(2));
            }
        }
        try (EmbeddedPostgresServer again = EmbeddedPostgresServer.start(data, 0);
             Connection c = DriverManager.getConnection(again.jdbcUrl()); var s = c.createStatement()) {
            var rs = s.executeQuery("SELECT v FROM kept");
            assertThat(rs.next()).isTrue();
            assertThat(rs.getString(1)).isEqualTo("survives a restart");
        }
    }

    @Test
    void aCommitIsAcknowledgedOnlyOnceItIsOnDisk() throws Exception {
        try (EmbeddedPostgresServer server = EmbeddedPostgresServer.start(dir.resolve("pgdata"), 0);
             Connection c = DriverManager.getConnection(server.jdbcUrl()); var s = c.createStatement()) {
            for (String durable : new String[] {"synchronous_commit", "fsync", "full_page_writes"}) {
                var rs = s.executeQuery("SHOW " + durable);
                rs.next();
                assertThat(rs.getString(1)).as(durable).isEqualTo("on");
            }
        }
    }

    @Test
    void aServerLeftByAKilledRunIsStoppedAndStartedAgain() throws Exception {
        Path data = dir.resolve("pgdata");
        // A child JVM starts the server and is then killed with SIGKILL, as a crash would: its postmaster
        // lives on and holds the folder.
        Process child = new ProcessBuilder(Path.of(System.getProperty("java.home"), "bin", "java").toString(),
                "-cp", System.getProperty("java.class.path"), StaleServerChild.class.getName(), data.toString())
                .redirectErrorStream(true).start();
        try (var out = new BufferedReader(new InputStreamReader(child.getInputStream(), StandardCharsets.UTF_8))) {
            String line;
            while ((line = out.readLine()) != null && !line.startsWith("READY")) {
                // wait for the child's server
            }
            assertThat(line).as("child started its server").startsWith("READY");
        }
        child.destroyForcibly();
        child.waitFor(20, TimeUnit.SECONDS);
        long stalePid = Long.parseLong(Files.readAllLines(data.resolve("postmaster.pid")).get(0).trim());
        assertThat(ProcessHandle.of(stalePid).map(ProcessHandle::isAlive)).as("postmaster outlived its JVM")
                .contains(true);

        try (EmbeddedPostgresServer server = EmbeddedPostgresServer.start(data, 0);
             Connection c = DriverManager.getConnection(server.jdbcUrl()); var s = c.createStatement()) {
            var rs = s.executeQuery("SELECT v FROM kept");
            assertThat(rs.next()).isTrue();
            assertThat(rs.getString(1)).isEqualTo("written before the crash");
        }
        assertThat(ProcessHandle.of(stalePid).map(ProcessHandle::isAlive).orElse(false)).isFalse();
    }
}

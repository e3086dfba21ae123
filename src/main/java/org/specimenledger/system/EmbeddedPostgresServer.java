package org.specimenledger.system;

import io.zonky.test.db.postgres.embedded.EmbeddedPostgres;
import java.io.IOException;
import java.io.UncheckedIOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.sql.Connection;
import java.sql.SQLException;
import java.time.Duration;
import java.util.List;
import java.util.Optional;
import org.slf4j.Logger;
import org.slf4j.LoggerFactory;

/**
 * A real PostgreSQL server run by the service itself, from binaries shipped in a Maven artifact, with
 * its data folder kept across restarts. Stopping the service stops the server; a server left running by
 * a killed run (the JVM died, the postmaster did not) is found through its {@code postmaster.pid} and
 * shut down before a new one starts on the same folder.
 */
public final class EmbeddedPostgresServer implements AutoCloseable {

    private static final Logger log = LoggerFactory.getLogger(EmbeddedPostgresServer.class);
    static final String DATABASE = "ledger";
    static final String USER = "postgres";

    private final EmbeddedPostgres server;

    private EmbeddedPostgresServer(EmbeddedPostgres server) {
        this.server = server;
    }

    /**
     * Starts the server on {@code dataDir} (created when absent; existing data is kept) and makes sure
     * the {@value #DATABASE} database exists.
     *
     * @param port TCP port on 127.0.0.1, or 0 for any free port
     */
    public static EmbeddedPostgresServer start(Path dataDir, int port) {
        try {
            Path dir = dataDir.toAbsolutePath().normalize();
            Files.createDirectories(dir.getParent());
            stopStaleServer(dir);
            EmbeddedPostgres.Builder builder = EmbeddedPostgres.builder()
                    .setDataDirectory(dir)
                    .setCleanDataDirectory(false)
                    .setPGStartupWait(Duration.ofSeconds(60))
                    .setServerConfig("listen_addresses", "127.0.0.1")
                    .setServerConfig("max_connections", "100")
                    // The launcher starts the server as suits throw-away test databases, with asynchronous commit
                    // (a commit is acknowledged before its write-ahead log is on disk: a crash of the server just
                    // after it loses the write; DatabaseRestartTest found 12 acknowledged rows lost in 3 crashes)
                    // and fsync off (its -F flag: a power cut or a crash of the machine could lose or corrupt
                    // data). A laboratory's records get PostgreSQL's own defaults, acknowledged means on disk;
                    // these -c options come after -F on the server's command line and so override it.
                    .setServerConfig("fsync", "on")
                    .setServerConfig("synchronous_commit", "on");
            if (port > 0) {
                builder.setPort(port);
            }
            EmbeddedPostgresServer started = new EmbeddedPostgresServer(builder.start());
            started.createDatabaseIfAbsent();
            log.info("Embedded PostgreSQL listening on 127.0.0.1:{} with data in {}", started.port(), dir);
            return started;
        } catch (IOException e) {
            throw new UncheckedIOException("could not start the embedded PostgreSQL on " + dataDir, e);
        }
    }

    /** JDBC URL of the ledger database on this server. */
    public String jdbcUrl() {
        return server.getJdbcUrl(USER, DATABASE);
    }

    public int port() {
        return server.getPort();
    }

    /** JDBC URL of any database on this server (used by tests to make fresh databases). */
    public String jdbcUrl(String database) {
        return server.getJdbcUrl(USER, database);
    }

    @Override
    public void close() {
        try {
            server.close();
        } catch (IOException e) {
            log.warn("Embedded PostgreSQL did not stop cleanly", e);
        }
    }

    private void createDatabaseIfAbsent() {
        try (Connection c = server.getPostgresDatabase().getConnection();
             var exists = c.prepareStatement("SELECT 1 FROM pg_database WHERE datname = ?")) {
            exists.setString(1, DATABASE);
            try (var rs = exists.executeQuery()) {
                if (!rs.next()) {
                    try (var create = c.createStatement()) {
                        create.execute("CREATE DATABASE " + DATABASE + " ENCODING 'UTF8'");
                    }
                }
            }
        } catch (SQLException e) {
            throw new IllegalStateException("could not create the " + DATABASE + " database", e);
        }
    }

    /**
     * A postmaster whose JVM was killed keeps running and holds the folder. Its pid file names it; we
     * ask it to shut down fast (SIGINT) and wait, so the new server finds the folder free.
     */
    static void stopStaleServer(Path dataDir) throws IOException {
        Path pidFile = dataDir.resolve("postmaster.pid");
        if (!Files.isRegularFile(pidFile)) {
            return;
        }
        List<String> lines = Files.readAllLines(pidFile);
        if (lines.isEmpty()) {
            return;
        }
        long pid;
        try {
            pid = Long.parseLong(lines.get(0).trim());
        } catch (NumberFormatException e) {
            return; // unreadable pid file: PostgreSQL itself will judge it on start
        }
        Optional<ProcessHandle> stale = ProcessHandle.of(pid)
                .filter(p -> p.info().command().map(cmd -> cmd.contains("postgres")).orElse(false));
        if (stale.isEmpty()) {
            return; // no such process: PostgreSQL removes a pid file whose process is gone
        }
        log.warn("A PostgreSQL server (pid {}) from an earlier run still holds {}; stopping it", pid, dataDir);
        sendSignal(pid, "INT");
        if (!waitForExit(stale.get(), Duration.ofSeconds(30))) {
            log.warn("Stale PostgreSQL (pid {}) ignored a fast shutdown; killing it", pid);
            stale.get().destroyForcibly();
            waitForExit(stale.get(), Duration.ofSeconds(10));
        }
    }

    private static void sendSignal(long pid, String signal) throws IOException {
        try {
            new ProcessBuilder("kill", "-" + signal, Long.toString(pid)).inheritIO().start().waitFor();
        } catch (InterruptedException e) {
            Thread.currentThread().interrupt();
        }
    }

    private static boolean waitForExit(ProcessHandle process, Duration timeout) {
        try {
            process.onExit().get(timeout.toMillis(), java.util.concurrent.TimeUnit.MILLISECONDS);
            return true;
        } catch (java.util.concurrent.TimeoutException e) {
            return false;
        } catch (java.util.concurrent.ExecutionException e) {
            return !process.isAlive();
        } catch (InterruptedException e) {
            Thread.currentThread().interrupt();
            return !process.isAlive();
        }
    }
}

package org.specimenledger.reliability;

import java.io.IOException;
import java.nio.file.Files;
import org.specimenledger.system.EmbeddedPostgresServer;

/**
 * An admin JDBC URL of a PostgreSQL server the reliability suite may create databases on: the one named by
 * {@code LEDGER_TEST_DB_URL}, else an embedded server started once for this JVM.
 */
final class AdminDatabase {

    private static String url;

    private AdminDatabase() {
    }

    static synchronized String url() {
        if (url == null) {
            String given = System.getenv("LEDGER_TEST_DB_URL");
            if (given != null && !given.isBlank()) {
                url = given;
            } else {
                try {
                    EmbeddedPostgresServer server = EmbeddedPostgresServer.start(
                            Files.createTempDirectory("ledger-rel-pg").resolve("data"), 0);
                    Runtime.getRuntime().addShutdownHook(new Thread(server::close));
                    url = server.jdbcUrl("postgres");
                } catch (IOException e) {
                    throw new IllegalStateException(e);
                }
            }
        }
        return url;
    }
}

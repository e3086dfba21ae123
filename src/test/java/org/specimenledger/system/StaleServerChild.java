package org.specimenledger.system;

import java.nio.file.Path;
import java.sql.DriverManager;

/** Run in a separate JVM by {@link EmbeddedPostgresServerTest}: starts a server, writes a row, waits to be killed. */
public final class StaleServerChild {

    private StaleServerChild() {
    }

    public static void main(String[] args) throws Exception {
        EmbeddedPostgresServer server = EmbeddedPostgresServer.start(Path.of(args[0]), 0);
        try (var c = DriverManager.getConnection(server.jdbcUrl()); var s = c.createStatement()) {
            s.execute("CREATE TABLE kept (v text)");
            s.execute("INSERT INTO kept VALUES ('written before the crash')");
        }
        System.out.println("READY " + server.port());
        System.out.flush();
        Thread.sleep(Long.MAX_VALUE);
    }
}

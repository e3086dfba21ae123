package org.specimenledger.system;

import org.springframework.boot.context.properties.ConfigurationProperties;
import org.springframework.boot.context.properties.bind.DefaultValue;

/**
 * Where the ledger's PostgreSQL is. With an empty {@code url} the service runs its own embedded
 * server; otherwise it connects to the external one (production, CI).
 */
@ConfigurationProperties("ledger.db")
public record LedgerDatabaseProperties(
        String url,
        String user,
        String password,
        @DefaultValue Embedded embedded) {

    public boolean external() {
        return url != null && !url.isBlank();
    }

    /** The embedded server's data folder (kept across restarts) and port. */
    public record Embedded(@DefaultValue("./var/pgdata") String dataDir, @DefaultValue("54329") int port) {
    }
}

package org.specimenledger.system;

import com.zaxxer.hikari.HikariConfig;
import com.zaxxer.hikari.HikariDataSource;
import java.nio.file.Path;
import org.springframework.context.annotation.Bean;
import org.springframework.context.annotation.Configuration;

/**
 * One data source, two origins: the external PostgreSQL named by {@code LEDGER_DB_URL}, or the
 * embedded server started here when none is named.
 */
@Configuration(proxyBeanMethods = false)
class DatabaseConfiguration {

    /** Present only in the embedded mode; closed by the context after the pool. */
    @Bean(destroyMethod = "close")
    EmbeddedDatabaseHolder embeddedDatabase(LedgerDatabaseProperties properties) {
        if (properties.external()) {
            return new EmbeddedDatabaseHolder(null);
        }
        return new EmbeddedDatabaseHolder(EmbeddedPostgresServer.start(
                Path.of(properties.embedded().dataDir()), properties.embedded().port()));
    }

    @Bean(destroyMethod = "close")
    HikariDataSource dataSource(LedgerDatabaseProperties properties, EmbeddedDatabaseHolder embedded,
            @org.springframework.beans.factory.annotation.Value("${ledger.db.pool-size:20}") int poolSize) {
        HikariConfig config = new HikariConfig();
        config.setPoolName("ledger");
        if (properties.external()) {
            config.setJdbcUrl(properties.url());
            if (properties.user() != null && !properties.user().isBlank()) {
                config.setUsername(properties.user());
            }
            if (properties.password() != null && !properties.password().isBlank()) {
                config.setPassword(properties.password());
            }
        } else {
            config.setJdbcUrl(embedded.server().jdbcUrl());
        }
        config.setMaximumPoolSize(poolSize);
        // Fail fast at start rather than at the first request, but survive a database restart later.
        config.setInitializationFailTimeout(30_000);
        config.setConnectionTimeout(10_000);
        // After a database restart every pooled connection is dead: test idle ones every 30 s and on borrow
        // (Hikari checks a connection idle for more than half a second), so the pool heals without a restart.
        config.setKeepaliveTime(30_000);
        config.setValidationTimeout(3_000);
        return new HikariDataSource(config);
    }

    /** Whether this run seeds demo data: {@code auto} means only in the embedded mode. */
    @Bean
    DatabaseMode databaseMode(LedgerDatabaseProperties properties) {
        return properties.external() ? DatabaseMode.EXTERNAL : DatabaseMode.EMBEDDED;
    }

    /** Wraps the optional embedded server so that the bean exists in both modes. */
    record EmbeddedDatabaseHolder(EmbeddedPostgresServer server) implements AutoCloseable {
        @Override
        public void close() {
            if (server != null) {
                server.close();
            }
        }
    }
}

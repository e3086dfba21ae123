package org.specimenledger.testing;

import java.nio.file.Path;
import org.springframework.boot.context.properties.ConfigurationProperties;
import org.springframework.boot.context.properties.bind.DefaultValue;
import org.springframework.util.unit.DataSize;

/**
 * Limits for a zip of curve files, checked on the bytes actually inflated (a zip's own size fields can lie).
 *
 * @param maxEntries most entries, folders included ({@code ledger.curve-batches.max-entries}, default 1000)
 * @param maxEntrySize largest inflated entry (default 64MB, the single-curve limit)
 * @param maxTotalSize most inflated bytes of all entries together, and the largest zip accepted (default 1GB)
 * @param spoolDir where the entries wait for the job (default: a folder in the system's temporary folder)
 */
@ConfigurationProperties("ledger.curve-batches")
public record CurveBatchSettings(@DefaultValue("1000") int maxEntries, @DefaultValue("64MB") DataSize maxEntrySize,
        @DefaultValue("1GB") DataSize maxTotalSize, @DefaultValue("") String spoolDir) {

    Path spoolFolder() {
        return spoolDir == null || spoolDir.isBlank()
                ? Path.of(System.getProperty("java.io.tmpdir"), "specimen-ledger-curve-batches")
                : Path.of(spoolDir);
    }
}

package org.specimenledger.certificates;

import java.time.ZoneId;
import org.springframework.boot.context.properties.ConfigurationProperties;
import org.springframework.boot.context.properties.bind.DefaultValue;

/**
 * Certificate settings ({@code ledger.certificates.*}).
 *
 * @param numberPrefix       the first part of every certificate number, e.g. {@code IC} in {@code IC-2026-00042}
 * @param zone               the laboratory's time zone: it decides the year of the number and the issue date
 * @param laboratoryName     printed at the top of every certificate and answered by the verification endpoint
 * @param laboratoryAddress  printed under the name (lines separated by LF)
 * @param verifyCapacity     public verification: requests one client address may make in a burst
 * @param verifyPerMinute    public verification: requests per minute given back to that client's allowance
 */
@ConfigurationProperties("ledger.certificates")
record CertificateSettings(@DefaultValue("IC") String numberPrefix, @DefaultValue("UTC") ZoneId zone,
        @DefaultValue("Specimen Ledger testing laboratory") String laboratoryName,
        @DefaultValue("Address not configured") String laboratoryAddress,
        @DefaultValue("30") int verifyCapacity, @DefaultValue("30") int verifyPerMinute) {

    CertificateSettings {
        if (!numberPrefix.matches("[A-Z][A-Z0-9]{0,7}")) {
            throw new IllegalArgumentException("ledger.certificates.number-prefix must be 1 to 8 capital letters or"
                    + " digits starting with a letter, was '" + numberPrefix + "'");
        }
        if (verifyCapacity < 1 || verifyPerMinute < 1) {
            throw new IllegalArgumentException("ledger.certificates.verify-capacity and verify-per-minute must be"
                    + " at least 1");
        }
    }
}

package org.specimenledger;

import org.springframework.boot.SpringApplication;
import org.springframework.boot.autoconfigure.SpringBootApplication;
import org.springframework.boot.context.properties.ConfigurationPropertiesScan;

/** Entry point of the Specimen Ledger service. */
@SpringBootApplication
@ConfigurationPropertiesScan
public class SpecimenLedgerApplication {

    public static void main(String[] args) {
        SpringApplication.run(SpecimenLedgerApplication.class, args);
    }
}

package org.specimenledger.testing;

import org.springframework.context.annotation.Bean;
import org.springframework.context.annotation.Configuration;

/** The requirement table the service uses: the defaults with the laboratory's configured values over them. */
@Configuration(proxyBeanMethods = false)
class StandardTable {

    @Bean
    StandardRequirements standardRequirements(StandardSettings settings) {
        return StandardRequirements.DEFAULTS.with(settings);
    }
}

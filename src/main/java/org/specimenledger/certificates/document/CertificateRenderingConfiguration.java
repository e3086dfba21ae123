package org.specimenledger.certificates.document;

import org.springframework.context.annotation.Bean;
import org.springframework.context.annotation.Configuration;
import org.springframework.context.annotation.Lazy;

/**
 * Makes one shared {@link CertificateRenderer} available to the service. Lazy, so the templates are
 * compiled (about two seconds, needs a full JDK) on the first certificate, not at every start.
 */
@Configuration(proxyBeanMethods = false)
class CertificateRenderingConfiguration {

    @Bean
    @Lazy
    CertificateRenderer certificateRenderer() {
        return new CertificateRenderer();
    }
}

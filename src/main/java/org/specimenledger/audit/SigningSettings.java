package org.specimenledger.audit;

import org.springframework.boot.context.properties.ConfigurationProperties;

/**
 * Where the laboratory's Ed25519 checkpoint key pair lives: a PEM PKCS#8 private key and a PEM X.509
 * SubjectPublicKeyInfo public key ({@code openssl pkey} reads both). When neither file exists the pair
 * is created there on first start, readable by the owner only.
 */
@ConfigurationProperties("ledger.signing")
record SigningSettings(String privateKeyFile, String publicKeyFile) {
}

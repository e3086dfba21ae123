package org.specimenledger.certificates.document;

/** Filling or exporting a certificate failed; the message names the certificate number. */
public class CertificateRenderingFailed extends RuntimeException {

    CertificateRenderingFailed(String number, Throwable cause) {
        super("cannot render certificate " + number + ": " + cause.getMessage(), cause);
    }
}

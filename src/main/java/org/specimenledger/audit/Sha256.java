package org.specimenledger.audit;

import java.nio.charset.StandardCharsets;
import java.security.MessageDigest;
import java.security.NoSuchAlgorithmException;
import java.util.HexFormat;

/** SHA-256 of UTF-8 text or of bytes, as lower-case hex. */
final class Sha256 {

    private Sha256() {
    }

    static String hex(String text) {
        return hex(text.getBytes(StandardCharsets.UTF_8));
    }

    static String hex(byte[] bytes) {
        try {
            MessageDigest digest = MessageDigest.getInstance("SHA-256");
            return HexFormat.of().formatHex(digest.digest(bytes));
        } catch (NoSuchAlgorithmException e) {
            throw new IllegalStateException("every JDK has SHA-256", e);
        }
    }
}

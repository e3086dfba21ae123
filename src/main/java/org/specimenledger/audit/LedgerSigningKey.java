package org.specimenledger.audit;

import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.FileAlreadyExistsException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.nio.file.StandardCopyOption;
import java.nio.file.attribute.PosixFilePermission;
import java.nio.file.attribute.PosixFilePermissions;
import java.security.GeneralSecurityException;
import java.security.KeyFactory;
import java.security.KeyPair;
import java.security.KeyPairGenerator;
import java.security.PrivateKey;
import java.security.PublicKey;
import java.security.Signature;
import java.security.spec.PKCS8EncodedKeySpec;
import java.security.spec.X509EncodedKeySpec;
import java.util.Base64;
import java.util.Set;
import org.slf4j.Logger;
import org.slf4j.LoggerFactory;
import org.springframework.beans.factory.annotation.Autowired;
import org.springframework.stereotype.Component;

/**
 * The laboratory's Ed25519 key pair for signing checkpoints (JDK built-in EdDSA, RFC 8032), kept as PEM
 * files: PKCS#8 for the private key, X.509 SubjectPublicKeyInfo for the public one, as
 * {@code openssl pkey} reads them. Created on first start when neither file exists; a half pair (one
 * file without the other) stops the start rather than silently making a new identity.
 */
@Component
class LedgerSigningKey {

    private static final Logger log = LoggerFactory.getLogger(LedgerSigningKey.class);
    static final String ALGORITHM = "Ed25519";
    private static final Set<PosixFilePermission> OWNER_ONLY = PosixFilePermissions.fromString("rw-------");

    private final PrivateKey privateKey;
    private final PublicKey publicKey;

    @Autowired
    LedgerSigningKey(SigningSettings settings) {
        this(Path.of(settings.privateKeyFile()), Path.of(settings.publicKeyFile()));
    }

    LedgerSigningKey(Path privateFile, Path publicFile) {
        try {
            boolean hasPrivate = Files.exists(privateFile);
            boolean hasPublic = Files.exists(publicFile);
            if (!hasPrivate && !hasPublic) {
                create(privateFile, publicFile);
            } else if (hasPrivate != hasPublic) {
                throw new IllegalStateException("checkpoint signing key: found " + (hasPrivate ? privateFile : publicFile)
                        + " but not " + (hasPrivate ? publicFile : privateFile) + "; restore the pair or remove both");
            }
            KeyFactory keys = KeyFactory.getInstance(ALGORITHM);
            this.privateKey = keys.generatePrivate(new PKCS8EncodedKeySpec(pemBody(privateFile, "PRIVATE KEY")));
            this.publicKey = keys.generatePublic(new X509EncodedKeySpec(pemBody(publicFile, "PUBLIC KEY")));
        } catch (IOException | GeneralSecurityException e) {
            throw new IllegalStateException("cannot load the checkpoint signing key from " + privateFile, e);
        }
        if (!verify(publicKey, new byte[] {1, 2, 3}, sign(new byte[] {1, 2, 3}))) {
            throw new IllegalStateException(privateFile + " and " + publicFile + " are not one key pair");
        }
    }

    byte[] sign(byte[] message) {
        try {
            Signature s = Signature.getInstance(ALGORITHM);
            s.initSign(privateKey);
            s.update(message);
            return s.sign();
        } catch (GeneralSecurityException e) {
            throw new IllegalStateException("Ed25519 signing failed", e);
        }
    }

    PublicKey publicKey() {
        return publicKey;
    }

    /** Lower-case hex SHA-256 of the public key's SubjectPublicKeyInfo DER. */
    String keyId() {
        return keyId(publicKey);
    }

    String publicKeyPem() {
        return pem("PUBLIC KEY", publicKey.getEncoded());
    }

    static String keyId(PublicKey key) {
        return Sha256.hex(key.getEncoded());
    }

    static boolean verify(PublicKey key, byte[] message, byte[] signature) {
        try {
            Signature s = Signature.getInstance(ALGORITHM);
            s.initVerify(key);
            s.update(message);
            return s.verify(signature);
        } catch (GeneralSecurityException e) {
            return false;
        }
    }

    /** Reads a PEM SubjectPublicKeyInfo Ed25519 key, as served at {@code GET /api/v1/ledger/key}. */
    static PublicKey readPublicKey(String pem) {
        try {
            return KeyFactory.getInstance(ALGORITHM).generatePublic(new X509EncodedKeySpec(pemBody(pem, "PUBLIC KEY")));
        } catch (GeneralSecurityException e) {
            throw new IllegalArgumentException("not an Ed25519 public key", e);
        }
    }

    private static void create(Path privateFile, Path publicFile) throws IOException, GeneralSecurityException {
        KeyPair pair = KeyPairGenerator.getInstance(ALGORITHM).generateKeyPair();
        write(privateFile, pem("PRIVATE KEY", pair.getPrivate().getEncoded()));
        write(publicFile, pem("PUBLIC KEY", pair.getPublic().getEncoded()));
        log.info("Created the checkpoint signing key pair {} / {} (key id {})", privateFile, publicFile,
                keyId(pair.getPublic()));
    }

    /** Written to a temporary file with owner-only permissions, then moved into place, so no reader sees it open. */
    private static void write(Path file, String text) throws IOException {
        Path dir = file.toAbsolutePath().getParent();
        boolean posix = dir.getFileSystem().supportedFileAttributeViews().contains("posix");
        if (!Files.isDirectory(dir)) {
            if (posix) {
                Files.createDirectories(dir, PosixFilePermissions.asFileAttribute(PosixFilePermissions.fromString("rwx------")));
            } else {
                Files.createDirectories(dir);
            }
        }
        Path tmp = posix ? Files.createTempFile(dir, ".key", ".tmp", PosixFilePermissions.asFileAttribute(OWNER_ONLY))
                : Files.createTempFile(dir, ".key", ".tmp");
        Files.writeString(tmp, text, StandardCharsets.US_ASCII);
        try {
            Files.move(tmp, file, StandardCopyOption.ATOMIC_MOVE);
        } catch (FileAlreadyExistsException e) {
            Files.deleteIfExists(tmp);
            throw e;
        }
        if (!posix) {
            file.toFile().setReadable(false, false);
            file.toFile().setReadable(true, true);
        }
    }

    static String pem(String label, byte[] der) {
        return "-----BEGIN " + label + "-----\n"
                + Base64.getMimeEncoder(64, new byte[] {'\n'}).encodeToString(der)
                + "\n-----END " + label + "-----\n";
    }

    private static byte[] pemBody(Path file, String label) throws IOException {
        return pemBody(Files.readString(file, StandardCharsets.US_ASCII), label);
    }

    private static byte[] pemBody(String pem, String label) {
        String begin = "-----BEGIN " + label + "-----";
        String end = "-----END " + label + "-----";
        int from = pem.indexOf(begin);
        int to = pem.indexOf(end);
        if (from < 0 || to < from) {
            throw new IllegalArgumentException("no " + begin + " block");
        }
        return Base64.getMimeDecoder().decode(pem.substring(from + begin.length(), to));
    }
}

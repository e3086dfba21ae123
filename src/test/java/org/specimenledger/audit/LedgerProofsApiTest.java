package org.specimenledger.audit;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;
import static org.junit.jupiter.api.Assumptions.assumeTrue;

import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.nio.file.attribute.PosixFilePermissions;
import java.security.PublicKey;
import java.time.Instant;
import java.util.ArrayList;
import java.util.Base64;
import java.util.HexFormat;
import java.util.List;
import java.util.Map;
import java.util.UUID;
import java.util.concurrent.TimeUnit;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.specimenledger.testsupport.Api;
import org.specimenledger.testsupport.IntegrationTest;
import org.specimenledger.testsupport.TestAccounts;
import org.springframework.beans.factory.annotation.Autowired;
import org.springframework.beans.factory.annotation.Value;
import org.springframework.jdbc.core.JdbcTemplate;
import tools.jackson.databind.JsonNode;

/** Signed checkpoints, the public key and Merkle proofs over HTTP, checked with outside tools where possible. */
class LedgerProofsApiTest extends IntegrationTest {

    private static final HexFormat HEX = HexFormat.of();

    @Autowired
    Checkpoints checkpoints;
    @Autowired
    JdbcTemplate jdbc;
    @Value("${ledger.signing.private-key-file}")
    String privateKeyFile;
    @Value("${ledger.signing.public-key-file}")
    String publicKeyFile;

    private Api auditor() {
        return as(TestAccounts.AUDITOR);
    }

    private String newCustomer() {
        return as(TestAccounts.MANAGER).post("/api/v1/customers",
                Map.of("name", "Proof Works " + UUID.randomUUID(), "address", "Quay 3")).id();
    }

    private JsonNode eventOf(String customerId) {
        return auditor().get("/api/v1/audit/events?entityType=customer&entityId=" + customerId).json().get("events")
                .get(0);
    }

    private PublicKey publicKey() {
        return LedgerSigningKey.readPublicKey(anonymous().get("/api/v1/ledger/key").json().get("publicKeyPem")
                .asString());
    }

    @Test
    void publicKeyIsServedAsJsonWithItsIdAndAsPemToAnyone() throws Exception {
        Api.Response json = anonymous().get("/api/v1/ledger/key");
        assertThat(json.status()).isEqualTo(200);
        assertThat(json.json().get("algorithm").asString()).isEqualTo("Ed25519");
        String pem = json.json().get("publicKeyPem").asString();
        assertThat(pem).startsWith("-----BEGIN PUBLIC KEY-----\n").endsWith("-----END PUBLIC KEY-----\n");
        PublicKey key = LedgerSigningKey.readPublicKey(pem);
        // key id: SHA-256 of the SubjectPublicKeyInfo DER, recomputed with the JDK's digest
        String der = HEX.formatHex(java.security.MessageDigest.getInstance("SHA-256").digest(key.getEncoded()));
        assertThat(json.json().get("keyId").asString()).isEqualTo(der);
        // the served key is the one in the configured file, which only its owner may read
        assertThat(Files.readString(Path.of(publicKeyFile))).isEqualTo(pem);
        if (Files.getFileStore(Path.of(privateKeyFile)).supportsFileAttributeView("posix")) {
            assertThat(PosixFilePermissions.toString(Files.getPosixFilePermissions(Path.of(privateKeyFile))))
                    .isEqualTo("rw-------");
            assertThat(PosixFilePermissions.toString(Files.getPosixFilePermissions(Path.of(publicKeyFile))))
                    .isEqualTo("rw-------");
        }

        Api.Response asPem = pem();
        assertThat(asPem.status()).isEqualTo(200);
        assertThat(asPem.contentType()).startsWith("application/x-pem-file");
        assertThat(asPem.body()).isEqualTo(pem);
    }

    @Test
    void recordedCheckpointSignsTheTreeHeadAndIsListedAndLatest() {
        newCustomer();
        CheckpointView recorded = checkpoints.record("test: on demand");
        long head = jdbc.queryForObject("SELECT last_seq FROM audit_chain_head", Long.class);
        assertThat(recorded.treeSize()).isEqualTo(head);
        // the signed root is the RFC 6962 root recomputed here from every stored canonical text
        List<byte[]> leaves = new ArrayList<>();
        jdbc.query("SELECT canonical FROM audit_event WHERE seq <= ? ORDER BY seq",
                rs -> {
                    leaves.add(MerkleTree.leafHash(rs.getString(1)));
                }, recorded.treeSize());
        assertThat(recorded.rootHash()).isEqualTo(HEX.formatHex(MerkleTree.root(MerkleTree.of(leaves), leaves.size())));
        assertThat(recorded.signedText()).isEqualTo("specimen-ledger checkpoint v1\n" + recorded.treeSize() + "\n"
                + recorded.rootHash() + "\n" + CanonicalEvent.TIME.format(recorded.recordedAt()) + "\n");
        assertThat(LedgerSigningKey.verify(publicKey(), recorded.signedBytes(), recorded.signatureBytes())).isTrue();

        JsonNode latest = anonymous().get("/api/v1/ledger/checkpoints/latest").json();
        assertThat(latest.get("id").asLong()).isEqualTo(recorded.id());
        assertThat(latest.get("rootHash").asString()).isEqualTo(recorded.rootHash());
        assertThat(latest.get("signature").asString()).isEqualTo(recorded.signature());
        assertThat(Instant.parse(latest.get("recordedAt").asString())).isEqualTo(recorded.recordedAt());

        JsonNode page = auditor().get("/api/v1/ledger/checkpoints?after=" + (recorded.id() - 1) + "&limit=1").json();
        assertThat(page.get("checkpoints").get(0).get("id").asLong()).isEqualTo(recorded.id());
        assertThat(page.get("checkpoints").get(0).get("signedText").asString()).isEqualTo(recorded.signedText());
    }

    @Test
    void scheduledRoundRecordsNothingWhenTheTreeDidNotGrow() {
        checkpoints.record("test: before the schedule");
        assertThat(checkpoints.recordIfDue()).isEmpty();
    }

    @Test
    void aCheckpointVerifiesWithTheOpensslBinaryAlone(@TempDir Path dir) throws Exception {
        assumeTrue(onPath("openssl", "version"), "openssl not on the PATH: skipping the outside signature check");
        newCustomer();
        CheckpointView c = checkpoints.record("test: checked with openssl");
        Path key = dir.resolve("key.pem");
        Path text = dir.resolve("checkpoint.txt");
        Path sig = dir.resolve("checkpoint.sig");
        Files.writeString(key, pem().body());
        Files.writeString(text, c.signedText(), StandardCharsets.UTF_8);
        Files.write(sig, Base64.getDecoder().decode(c.signature()));
        Run ok = run("openssl", "pkeyutl", "-verify", "-pubin", "-inkey", key.toString(), "-rawin",
                "-in", text.toString(), "-sigfile", sig.toString());
        assertThat(ok.exit()).as(ok.output()).isZero();
        assertThat(ok.output()).contains("Signature Verified Successfully");

        Files.writeString(text, c.signedText().replace("\n" + c.treeSize() + "\n", "\n" + (c.treeSize() + 1) + "\n"));
        Run forged = run("openssl", "pkeyutl", "-verify", "-pubin", "-inkey", key.toString(), "-rawin",
                "-in", text.toString(), "-sigfile", sig.toString());
        assertThat(forged.exit()).as(forged.output()).isNotZero();
        // openssl also reads the private key file as PKCS#8
        Run pkey = run("openssl", "pkey", "-in", privateKeyFile, "-noout", "-text");
        assertThat(pkey.exit()).as(pkey.output()).isZero();
        assertThat(pkey.output()).contains("ED25519 Private-Key");
    }

    @Test
    void inclusionProofOfAnEventVerifiesAgainstTheSignedCheckpoint() {
        String id = newCustomer();
        JsonNode event = eventOf(id);
        long seq = event.get("seq").asLong();
        CheckpointView c = checkpoints.record("test: inclusion");

        JsonNode proof = auditor().get("/api/v1/ledger/proof/" + seq).json();
        assertThat(proof.get("leafIndex").asLong()).isEqualTo(seq - 1);
        assertThat(proof.get("checkpoint").get("id").asLong()).isLessThanOrEqualTo(c.id());
        long size = proof.get("treeSize").asLong();
        assertThat(size).isEqualTo(proof.get("checkpoint").get("treeSize").asLong()).isGreaterThanOrEqualTo(seq);
        // the leaf is SHA-256(0x00 ‖ canonical text) of the event as the events API returns it
        byte[] leaf = MerkleTree.leafHash(event.get("canonical").asString());
        assertThat(proof.get("leafHash").asString()).isEqualTo(HEX.formatHex(leaf));
        byte[] signedRoot = HEX.parseHex(proof.get("checkpoint").get("rootHash").asString());
        assertThat(MerkleTree.verifyInclusion(seq - 1, size, leaf, hashes(proof.get("auditPath")), signedRoot)).isTrue();

        JsonNode explicit = auditor().get("/api/v1/ledger/proof/" + seq + "?treeSize=" + c.treeSize()).json();
        assertThat(explicit.get("checkpoint").get("id").asLong()).isEqualTo(c.id());
        assertThat(MerkleTree.verifyInclusion(seq - 1, c.treeSize(), leaf, hashes(explicit.get("auditPath")),
                HEX.parseHex(c.rootHash()))).isTrue();

        // a tree size no checkpoint has: proof against the stored tree's root at that size, no checkpoint
        JsonNode bare = auditor().get("/api/v1/ledger/proof/" + seq + "?treeSize=" + seq).json();
        assertThat(bare.get("treeSize").asLong()).isEqualTo(seq);
        assertThat(MerkleTree.verifyInclusion(seq - 1, seq, leaf, hashes(bare.get("auditPath")),
                HEX.parseHex(bare.get("rootHash").asString()))).isTrue();
    }

    @Test
    void consistencyProofBetweenTwoCheckpointsVerifies() {
        newCustomer();
        CheckpointView first = checkpoints.record("test: consistency, first");
        newCustomer();
        newCustomer();
        CheckpointView second = checkpoints.record("test: consistency, second");
        JsonNode proof = auditor().get("/api/v1/ledger/consistency?from=" + first.treeSize() + "&to="
                + second.treeSize()).json();
        assertThat(proof.get("fromCheckpoint").get("id").asLong()).isEqualTo(first.id());
        assertThat(proof.get("toCheckpoint").get("id").asLong()).isEqualTo(second.id());
        assertThat(proof.get("fromRoot").asString()).isEqualTo(first.rootHash());
        assertThat(proof.get("toRoot").asString()).isEqualTo(second.rootHash());
        assertThat(MerkleTree.verifyConsistency(first.treeSize(), second.treeSize(), HEX.parseHex(first.rootHash()),
                HEX.parseHex(second.rootHash()), hashes(proof.get("proof")))).isTrue();
        // signatures of both heads hold, so the signed history was only ever appended to
        assertThat(LedgerSigningKey.verify(publicKey(), first.signedBytes(), first.signatureBytes())).isTrue();
        assertThat(LedgerSigningKey.verify(publicKey(), second.signedBytes(), second.signatureBytes())).isTrue();

        JsonNode same = auditor().get("/api/v1/ledger/consistency?from=" + second.treeSize() + "&to="
                + second.treeSize()).json();
        assertThat(same.get("proof")).isEmpty();
    }

    @Test
    void unknownEventIs404AndSizesOutOfRangeAre422NamingTheParameter() {
        newCustomer();
        long head = jdbc.queryForObject("SELECT last_seq FROM audit_chain_head", Long.class);

        Api.Response unknown = auditor().get("/api/v1/ledger/proof/" + (head + 1000));
        assertThat(unknown.status()).isEqualTo(404);
        assertThat(unknown.contentType()).startsWith("application/problem+json");
        assertThat(auditor().get("/api/v1/ledger/proof/0").status()).isEqualTo(404);

        Api.Response tooSmall = auditor().get("/api/v1/ledger/proof/" + head + "?treeSize=" + (head - 1));
        assertProblem(tooSmall, 422, "treeSize", "treeSize must be between the event's sequence number " + head);
        Api.Response tooLarge = auditor().get("/api/v1/ledger/proof/1?treeSize=" + (head + 5000));
        assertProblem(tooLarge, 422, "treeSize", "was " + (head + 5000));

        assertProblem(auditor().get("/api/v1/ledger/consistency?from=2&to=1"), 422, "from",
                "from must be between 0 and to (1), was 2");
        assertProblem(auditor().get("/api/v1/ledger/consistency?from=1&to=" + (head + 5000)), 422, "to",
                "to must be between 0 and the current tree size");
        assertProblem(auditor().get("/api/v1/ledger/consistency?from=-1&to=1"), 422, "from", "was -1");
        assertProblem(auditor().get("/api/v1/ledger/consistency?from=x&to=1"), 400, "from", "invalid value 'x'");
        assertThat(auditor().get("/api/v1/ledger/consistency?to=1").status()).isEqualTo(400);
        assertProblem(auditor().get("/api/v1/ledger/proof/abc"), 400, "seq", "invalid value 'abc'");
    }

    @Test
    void storedCheckpointsAndTreeNodesCannotBeChanged() {
        newCustomer();
        checkpoints.record("test: immutable");
        assertThatThrownBy(() -> jdbc.update("UPDATE ledger_checkpoint SET tree_size = 0"))
                .rootCause().hasMessageContaining("append-only");
        assertThatThrownBy(() -> jdbc.update("DELETE FROM ledger_checkpoint"))
                .rootCause().hasMessageContaining("append-only");
        assertThatThrownBy(() -> jdbc.update("UPDATE ledger_tree_node SET hash = hash WHERE level = 0"))
                .rootCause().hasMessageContaining("append-only");
        assertThatThrownBy(() -> jdbc.execute("TRUNCATE ledger_tree_node"))
                .rootCause().hasMessageContaining("append-only");
        assertThatThrownBy(() -> jdbc.execute("TRUNCATE ledger_checkpoint"))
                .rootCause().hasMessageContaining("append-only");
    }

    @Test
    void everyRoleOnEveryLedgerEndpoint() {
        newCustomer();
        checkpoints.record("test: roles");
        List<String> readers = List.of("/api/v1/ledger/checkpoints", "/api/v1/ledger/proof/1",
                "/api/v1/ledger/consistency?from=1&to=1");
        for (String path : readers) {
            assertThat(as(TestAccounts.MANAGER).get(path).status()).as(path).isEqualTo(200);
            assertThat(as(TestAccounts.AUDITOR).get(path).status()).as(path).isEqualTo(200);
            assertThat(as(TestAccounts.TECHNICIAN).get(path).status()).as(path).isEqualTo(403);
            assertThat(as(TestAccounts.CUSTOMER).get(path).status()).as(path).isEqualTo(403);
            assertThat(anonymous().get(path).status()).as(path).isEqualTo(401);
        }
        for (String path : List.of("/api/v1/ledger/key", "/api/v1/ledger/checkpoints/latest")) {
            for (String user : List.of(TestAccounts.MANAGER, TestAccounts.AUDITOR, TestAccounts.TECHNICIAN,
                    TestAccounts.CUSTOMER)) {
                assertThat(as(user).get(path).status()).as(user + " " + path).isEqualTo(200);
            }
            assertThat(anonymous().get(path).status()).as(path).isEqualTo(200);
        }
        // the public paths are exactly those two: nothing else under /ledger opens up
        assertThat(anonymous().get("/api/v1/ledger/checkpoints/1").status()).isEqualTo(401);
    }

    /** The key as PEM, asked for by media type (the test client sends no Accept header of its own). */
    private Api.Response pem() {
        try {
            var response = java.net.http.HttpClient.newHttpClient().send(java.net.http.HttpRequest
                    .newBuilder(java.net.URI.create("http://127.0.0.1:" + port + "/api/v1/ledger/key"))
                    .header("Accept", "application/x-pem-file").GET().build(),
                    java.net.http.HttpResponse.BodyHandlers.ofString());
            return new Api.Response(response.statusCode(), response.body(),
                    response.headers().firstValue("Content-Type").orElse(""));
        } catch (IOException | InterruptedException e) {
            throw new IllegalStateException(e);
        }
    }

    private static void assertProblem(Api.Response r, int status, String pointer, String detailPart) {
        assertThat(r.status()).as(r.toString()).isEqualTo(status);
        assertThat(r.contentType()).startsWith("application/problem+json");
        JsonNode error = r.json().get("errors").get(0);
        assertThat(error.get("pointer").asString()).isEqualTo(pointer);
        assertThat(error.get("detail").asString()).contains(detailPart);
    }

    private static List<byte[]> hashes(JsonNode array) {
        List<byte[]> out = new ArrayList<>();
        array.forEach(n -> out.add(HEX.parseHex(n.asString())));
        return out;
    }

    record Run(int exit, String output) {
    }

    /** Whether {@code tool versionArgument} runs and succeeds. */
    static boolean onPath(String tool, String versionArgument) {
        try {
            return run(tool, versionArgument).exit() == 0;
        } catch (IOException e) {
            return false;
        }
    }

    static Run run(String... command) throws IOException {
        Process p = new ProcessBuilder(command).redirectErrorStream(true).start();
        try {
            String out = new String(p.getInputStream().readAllBytes(), StandardCharsets.UTF_8);
            if (!p.waitFor(60, TimeUnit.SECONDS)) {
                p.destroyForcibly();
                return new Run(-1, out + " (timed out)");
            }
            return new Run(p.exitValue(), out);
        } catch (InterruptedException e) {
            Thread.currentThread().interrupt();
            throw new IOException(e);
        }
    }
}

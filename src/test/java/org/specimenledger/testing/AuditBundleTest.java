package org.specimenledger.testing;

import static org.assertj.core.api.Assertions.assertThat;

import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import java.util.concurrent.TimeUnit;
import java.util.stream.Stream;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.specimenledger.testsupport.Api;
import org.specimenledger.testsupport.TestAccounts;
import org.specimenledger.testsupport.Zips;

/**
 * The audit bundle checked the way an outsider checks it: unpacked, then {@code bash VERIFY.txt} run
 * literally, so the only code trusted is bash, coreutils, grep, sed and openssl (Ed25519 as RFC 8032,
 * Merkle audit paths as RFC 9162 §2.1.3.2). Changing any one proven file must make the same commands fail.
 */
class AuditBundleTest extends TestRunTesting {

    @TempDir
    Path dir;

    record Run(int exit, String output) {
    }

    @Test
    void bundleVerifiesByItsOwnInstructionsAndTamperingIsCaught() throws Exception {
        TestRunFixtures.Bench b = bench();
        String run = register(b);
        byte[] curve = TestRunFixtures.curve(b);
        uploaded(run, curve);
        // later events on the same records, so that the bundle spans more than one state
        assertThat(as(TestAccounts.AUDITOR).post("/api/v1/analyses/"
                + technician().get("/api/v1/tests/" + run).json().get("currentAnalysisId").asString() + "/replay", "")
                .status()).isEqualTo(200);

        Api.Download zip = as(TestAccounts.AUDITOR).getBytes("/api/v1/trace/tests/" + run + "/bundle");
        assertThat(zip.status()).isEqualTo(200);
        assertThat(zip.header("Content-Type")).isEqualTo("application/zip");
        Zips.unzip(zip.body(), dir);

        assertThat(dir.resolve("VERIFY.txt")).exists();
        assertThat(dir.resolve("public-key.pem")).exists();
        assertThat(list("events")).isNotEmpty();
        assertThat(list("records")).anyMatch(p -> p.startsWith("analysis-")).anyMatch(p -> p.startsWith("raw-curve-"))
                .anyMatch(p -> p.startsWith("test-run-")).anyMatch(p -> p.startsWith("specimen-"))
                .anyMatch(p -> p.startsWith("heat-")).anyMatch(p -> p.startsWith("calibration-"))
                .anyMatch(p -> p.startsWith("equipment-"));
        Path curveFile = dir.resolve("curves").resolve(list("curves").get(0));
        assertThat(Files.readAllBytes(curveFile)).isEqualTo(curve);

        Run ok = verify();
        assertThat(ok.exit()).as(ok.output()).isZero();
        assertThat(ok.output()).contains("ALL CHECKS PASSED").doesNotContain("FAILED");

        // one byte of the raw curve
        tamper(curveFile, bytes -> bytes[bytes.length / 2] ^= 1, "FAILED: curves/");
        // one event's text: a changed actor name, same length
        Path event = dir.resolve("events").resolve(list("events").get(0));
        tamper(event, bytes -> {
            String s = new String(bytes, StandardCharsets.UTF_8);
            int at = s.indexOf("\"actor\":\"") + 9;
            bytes[at] = (byte) (bytes[at] == 'x' ? 'y' : 'x');
        }, "FAILED: events/");
        // a record's state
        Path record = dir.resolve("records").resolve(list("records").stream().filter(p -> p.startsWith("specimen-"))
                .findFirst().orElseThrow());
        tamper(record, bytes -> {
            String s = new String(bytes, StandardCharsets.UTF_8);
            int at = s.indexOf("\"labIdentifier\":\"") + 17;
            bytes[at] = (byte) (bytes[at] == 'Q' ? 'R' : 'Q');
        }, "FAILED: records/specimen-");
        // the signature, and the signed text
        tamper(dir.resolve("checkpoint/signature.bin"), bytes -> bytes[0] ^= 1, "FAILED: checkpoint/signature.bin");
        tamper(dir.resolve("checkpoint/signed-text.txt"), bytes -> bytes[bytes.length - 3] ^= 1,
                "FAILED: checkpoint/signature.bin");
        // one hash of an audit path
        Path proof = Files.list(dir.resolve("proofs")).filter(p -> {
            try {
                return Files.readAllLines(p).size() > 2;
            } catch (IOException e) {
                throw new IllegalStateException(e);
            }
        }).findFirst().orElseThrow();
        tamper(proof, bytes -> bytes[bytes.length - 2] = (byte) (bytes[bytes.length - 2] == 'a' ? 'b' : 'a'),
                "FAILED: events/");

        assertThat(verify().exit()).as("every file restored").isZero();
    }

    interface Change {
        void apply(byte[] bytes);
    }

    /** Changes one file, checks that VERIFY.txt now fails naming it, and puts the original back. */
    private void tamper(Path file, Change change, String expected) throws Exception {
        byte[] original = Files.readAllBytes(file);
        byte[] changed = original.clone();
        change.apply(changed);
        Files.write(file, changed);
        Run r = verify();
        assertThat(r.exit()).as(file + "\n" + r.output()).isEqualTo(1);
        assertThat(r.output()).as(file.toString()).contains(expected).doesNotContain("ALL CHECKS PASSED");
        Files.write(file, original);
    }

    private Run verify() throws Exception {
        Process p = new ProcessBuilder("bash", "VERIFY.txt").directory(dir.toFile()).redirectErrorStream(true).start();
        byte[] out = p.getInputStream().readAllBytes();
        assertThat(p.waitFor(120, TimeUnit.SECONDS)).isTrue();
        return new Run(p.exitValue(), new String(out, StandardCharsets.UTF_8));
    }

    private List<String> list(String folder) throws IOException {
        try (Stream<Path> s = Files.list(dir.resolve(folder))) {
            return s.map(p -> p.getFileName().toString()).sorted().toList();
        }
    }

}

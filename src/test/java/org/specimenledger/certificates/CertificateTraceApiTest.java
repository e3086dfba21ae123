package org.specimenledger.certificates;

import static org.assertj.core.api.Assertions.assertThat;

import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.security.MessageDigest;
import java.util.HexFormat;
import java.util.concurrent.TimeUnit;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.specimenledger.testsupport.Api;
import org.specimenledger.testsupport.TestAccounts;
import org.specimenledger.testsupport.Zips;
import tools.jackson.databind.JsonNode;

/**
 * The trace and audit bundle with a certificate at the root: every certificate line reaches its analysis and
 * raw curve, customers see only their own, and the bundle verifies by running its VERIFY.txt with bash alone
 * (JDK SHA-256 as the oracle of the PDF hash).
 */
class CertificateTraceApiTest extends CertificateTesting {

    @TempDir
    Path dir;

    @Test
    void everyLineTracesToItsRawCurveAndTheBundleVerifies() throws Exception {
        CertificateBench.Order order = bench().order(customerId(), passingRequirements(), 2);
        JsonNode c = issued(draft(order, order.specimenIds(), null, false).get("id").asString());
        String number = c.get("number").asString();

        long eventsBefore = count("audit_event");
        Api.Response trace = as(TestAccounts.AUDITOR).get("/api/v1/trace/certificates/" + number);
        assertThat(trace.status()).as(trace.toString()).isEqualTo(200);
        JsonNode t = trace.json();
        assertThat(t.get("ledgerSeq").asLong()).isEqualTo(c.get("ledgerSeq").asLong());
        assertThat(t.get("pdfSha256").asString()).isEqualTo(c.get("pdfSha256").asString());
        assertThat(t.get("pdfEventSeq").asLong()).isGreaterThan(t.get("ledgerSeq").asLong());
        assertThat(t.get("trace").get("lines")).hasSize(c.get("lines").size());
        assertThat(t.toString()).contains(c.get("lines").get(0).get("analysisRunId").asString());
        assertThat(count("audit_event")).as("reading a trace records nothing").isEqualTo(eventsBefore);

        Api.Response one = as(TestAccounts.CUSTOMER).get("/api/v1/trace/certificates/" + number + "/lines/1");
        assertThat(one.status()).as(one.toString()).isEqualTo(200);
        assertThat(one.json().get("trace").get("lines")).hasSize(1);
        assertThat(as(TestAccounts.OTHER_CUSTOMER).get("/api/v1/trace/certificates/" + number).status()).isEqualTo(404);
        assertThat(as(TestAccounts.CUSTOMER).get("/api/v1/trace/certificates/" + number + "/bundle").status())
                .isEqualTo(403);
        assertThat(manager().get("/api/v1/trace/certificates/IC-1999-99999").status()).isEqualTo(404);

        Api.Download zip = as(TestAccounts.AUDITOR).getBytes("/api/v1/trace/certificates/" + number + "/bundle");
        assertThat(zip.status()).isEqualTo(200);
        Zips.unzip(zip.body(), dir);
        byte[] pdf = Files.readAllBytes(dir.resolve("document.pdf"));
        assertThat(HexFormat.of().formatHex(MessageDigest.getInstance("SHA-256").digest(pdf)))
                .isEqualTo(c.get("pdfSha256").asString());
        Process p = new ProcessBuilder("bash", "VERIFY.txt").directory(dir.toFile()).redirectErrorStream(true).start();
        String out = new String(p.getInputStream().readAllBytes(), StandardCharsets.UTF_8);
        assertThat(p.waitFor(120, TimeUnit.SECONDS)).isTrue();
        assertThat(p.exitValue()).as(out).isZero();
        assertThat(out).contains("ALL CHECKS PASSED");

        // one changed byte of the PDF and the same script refuses it
        pdf[pdf.length / 2] ^= 1;
        Files.write(dir.resolve("document.pdf"), pdf);
        Process again = new ProcessBuilder("bash", "VERIFY.txt").directory(dir.toFile()).redirectErrorStream(true)
                .start();
        String out2 = new String(again.getInputStream().readAllBytes(), StandardCharsets.UTF_8);
        assertThat(again.waitFor(120, TimeUnit.SECONDS)).isTrue();
        assertThat(again.exitValue()).as(out2).isNotZero();
    }
}

package org.specimenledger.testing;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;

import java.io.InputStream;
import java.io.OutputStream;
import java.net.Socket;
import java.nio.charset.StandardCharsets;
import java.util.Map;
import java.util.UUID;
import org.junit.jupiter.api.Test;
import org.specimenledger.testsupport.Api;
import org.specimenledger.testsupport.TestAccounts;
import org.springframework.beans.factory.annotation.Autowired;
import org.springframework.dao.DataAccessException;
import org.springframework.transaction.support.TransactionTemplate;

/**
 * Raw curve uploads: every refusal leaves no raw curve, no analysis and no ledger event behind, and the
 * database itself refuses to change a stored curve or analysis.
 */
class CurveUploadApiTest extends TestRunTesting {

    @Autowired
    private TransactionTemplate transactions;

    @Test
    void uploadToAnUnknownTestIsNotFound() {
        Map<String, Long> before = footprint();
        Api.Response r = upload(UUID.randomUUID().toString(), "force [N],extension [mm]\n".getBytes(StandardCharsets.UTF_8));
        assertThat(r.status()).isEqualTo(404);
        assertThat(r.contentType()).startsWith("application/problem+json");
        assertThat(footprint()).isEqualTo(before);
    }

    @Test
    void aSecondUploadToTheSameTestIsRefused() {
        TestRunFixtures.Bench b = bench();
        String id = register(b);
        byte[] curve = TestRunFixtures.curve(b);
        uploaded(id, curve);
        Map<String, Long> before = footprint();
        Api.Response again = upload(id, SyntheticCurves.labelled("corrected", curve));
        assertThat(again.status()).as(again.toString()).isEqualTo(409);
        assertThat(again.json().get("detail").asString()).contains("already has its raw curve")
                .contains("needs a new test run");
        assertThat(footprint()).isEqualTo(before);
    }

    @Test
    void theSameBytesForAnotherTestNeedConfirmationAndAReason() {
        TestRunFixtures.Bench b = bench();
        String first = register(b);
        byte[] curve = TestRunFixtures.curve(b);
        uploaded(first, curve);
        TestRunFixtures.Bench other = bench();
        String second = register(other);

        Map<String, Long> before = footprint();
        Api.Response refused = upload(second, curve);
        assertThat(refused.status()).as(refused.toString()).isEqualTo(409);
        assertThat(refused.json().get("otherTestRunId").asString()).isEqualTo(first);
        assertThat(refused.json().get("detail").asString()).contains(first).contains("confirmDuplicate=true");
        assertProblem(upload(second, curve, "confirmDuplicate=true"), 422, "reason", "needs a reason");
        assertThat(footprint()).isEqualTo(before);

        Api.Response confirmed = upload(second, curve, "confirmDuplicate=true",
                "reason=two+pieces+of+one+bar+gave+one+file%3A+export+repeated+by+the+machine");
        assertThat(confirmed.status()).as(confirmed.toString()).isEqualTo(201);
        assertThat(confirmed.json().get("curve").get("duplicateOfTestRunId").asString()).isEqualTo(first);
        String curveId = confirmed.json().get("curve").get("id").asString();
        assertThat(events("raw-curve", curveId).get(0).get("reason").asString()).startsWith("two pieces of one bar");
    }

    @Test
    void aMalformedFileIsRefusedWithTheReadersLineAndColumnAndNothingIsStored() {
        String id = register(bench());
        Map<String, Long> before = footprint();
        byte[] bad = "force [kN],extension [mm]\n1.0,0.1\n2.0,abc\n".getBytes(StandardCharsets.UTF_8);
        Api.Response r = upload(id, bad);
        assertThat(r.status()).isEqualTo(422);
        assertThat(r.contentType()).startsWith("application/problem+json");
        assertThat(r.json().get("line").asInt()).isEqualTo(3);
        assertThat(r.json().get("column").asInt()).isEqualTo(2);
        assertThat(r.json().get("detail").asString()).contains("abc");
        assertThat(footprint()).isEqualTo(before);
        // the run is still open for its real file
        assertThat(technician().get("/api/v1/tests/" + id).json().get("rawCurve").isNull()).isTrue();
    }

    @Test
    void anUploadAnnouncedAboveTheLimitIsRefusedBeforeItsBodyIsRead() throws Exception {
        String id = register(bench());
        Map<String, Long> before = footprint();
        // announce 100 MB (the limit is 64 MB) and send only a few bytes: the answer must come without the rest
        try (Socket socket = new Socket("127.0.0.1", port)) {
            socket.setSoTimeout(10_000);
            String auth = java.util.Base64.getEncoder().encodeToString((TestAccounts.TECHNICIAN + ":"
                    + TestAccounts.PASSWORD).getBytes(StandardCharsets.UTF_8));
            OutputStream out = socket.getOutputStream();
            out.write(("PUT /api/v1/tests/" + id + "/curve HTTP/1.1\r\nHost: 127.0.0.1\r\nAuthorization: Basic " + auth
                    + "\r\nContent-Type: text/csv\r\nContent-Length: 100000000\r\nConnection: close\r\n\r\n"
                    + "force [N],extension [mm]\n").getBytes(StandardCharsets.US_ASCII));
            out.flush();
            String response = responseOf(socket.getInputStream());
            assertThat(response).startsWith("HTTP/1.1 413");
            assertThat(response).contains("curve-too-large").contains("100000000 bytes");
        }
        assertThat(footprint()).isEqualTo(before);
    }

    @Test
    void storedCurvesAndAnalysesCannotBeChangedInTheDatabase() {
        TestRunFixtures.Bench b = bench();
        String id = register(b);
        var received = uploaded(id, TestRunFixtures.curve(b));
        UUID curve = UUID.fromString(received.get("curve").get("id").asString());
        UUID analysis = UUID.fromString(received.get("analysis").get("id").asString());
        UUID run = UUID.fromString(id);

        refused("UPDATE raw_curve SET media_type = 'text/plain' WHERE id = ?", curve);
        refused("DELETE FROM raw_curve WHERE id = ?", curve);
        refused("UPDATE raw_curve_content SET content = content || '\\x0a'::bytea WHERE raw_curve_id = ?", curve);
        refused("DELETE FROM raw_curve_content WHERE raw_curve_id = ?", curve);
        refused("UPDATE analysis_run SET results = '{}'::jsonb WHERE id = ?", analysis);
        refused("DELETE FROM analysis_run WHERE id = ?", analysis);
        refused("TRUNCATE analysis_run CASCADE");
        refused("TRUNCATE raw_curve_content");
        // a test run's registered facts are fixed; only its validity and current analysis change
        refused("UPDATE test_run SET temperature_c = 20 WHERE id = ?", run);
        refused("DELETE FROM test_run WHERE id = ?", run);
        // bytes must be what their description says (SHA-256 and size, checked by the database)
        refused("INSERT INTO raw_curve_content (raw_curve_id, sha256, size_bytes, content) "
                + "SELECT id, sha256, size_bytes, '\\x00'::bytea FROM raw_curve WHERE id = ?", curve);
        assertThat(technician().getBytes("/api/v1/tests/" + id + "/curve").body())
                .isEqualTo(TestRunFixtures.curve(b));
    }

    /** Reads one HTTP response: its head, then as many body bytes as its Content-Length says. */
    private static String responseOf(InputStream in) throws java.io.IOException {
        StringBuilder text = new StringBuilder();
        int end = -1;
        int length = -1;
        byte[] buffer = new byte[4096];
        while (end < 0 || text.length() < end + 4 + length) {
            int n = in.read(buffer);
            if (n < 0) {
                break;
            }
            text.append(new String(buffer, 0, n, StandardCharsets.UTF_8));
            end = text.indexOf("\r\n\r\n");
            if (end >= 0 && length < 0) {
                var m = java.util.regex.Pattern.compile("(?i)content-length: *(\\d+)").matcher(text.substring(0, end));
                length = m.find() ? Integer.parseInt(m.group(1)) : 0;
            }
        }
        return text.toString();
    }

    private void refused(String sql, Object... params) {
        assertThatThrownBy(() -> transactions.executeWithoutResult(t -> jdbc.sql(sql).params(params).update()))
                .as(sql).isInstanceOf(DataAccessException.class);
    }
}

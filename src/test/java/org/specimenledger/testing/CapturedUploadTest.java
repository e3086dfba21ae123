package org.specimenledger.testing;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;

import java.io.ByteArrayInputStream;
import java.util.Random;
import org.junit.jupiter.api.Test;
import org.specimenledger.curve.CurveReader;
import org.specimenledger.curve.RawCurve;

/** The upload is read once: the reader parses what passes, and the copy is exactly the bytes received. */
class CapturedUploadTest {

    @Test
    void theCopyIsTheFileByteForByteAndTheFingerprintIsTheReaders() throws Exception {
        byte[] file = SyntheticCurves.rambergOsgood(200_000, 300, 10, 100, 50, 0.05, 5000);
        for (long announced : new long[] {file.length, -1, 10}) {
            CapturedUpload captured = new CapturedUpload(new ByteArrayInputStream(file), announced, 1 << 20);
            RawCurve curve = new CurveReader().read(captured);
            captured.drain();
            assertThat(captured.bytes()).isEqualTo(file);
            assertThat(curve.sha256()).isEqualTo(AnalysisReplay.sha256(file));
        }
    }

    @Test
    void oneByteOverTheLimitStopsTheUpload() throws Exception {
        byte[] file = new byte[1001];
        new Random(7).nextBytes(file);
        CapturedUpload captured = new CapturedUpload(new ByteArrayInputStream(file), -1, 1000);
        assertThatThrownBy(captured::drain).isInstanceOf(CurveTooLarge.class).hasMessageContaining("limit of 1000 bytes");
        CapturedUpload exact = new CapturedUpload(new ByteArrayInputStream(file, 0, 1000), 1000, 1000);
        exact.drain();
        assertThat(exact.bytes()).hasSize(1000);
    }
}

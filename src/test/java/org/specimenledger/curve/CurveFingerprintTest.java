package org.specimenledger.curve;

import static org.assertj.core.api.Assertions.assertThat;
import static org.specimenledger.curve.CurveFixtures.resource;
import static org.specimenledger.curve.CurveFixtures.utf8;

import java.nio.charset.StandardCharsets;
import java.security.MessageDigest;
import java.security.NoSuchAlgorithmException;
import java.util.HexFormat;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.ValueSource;

/**
 * The SHA-256 fingerprint is of the exact bytes read, checked against
 * {@link java.security.MessageDigest} over the same bytes (the JDK as the oracle).
 */
class CurveFingerprintTest {

    private final CurveReader reader = new CurveReader();

    @ParameterizedTest
    @ValueSource(strings = {"synthetic-comma-kn.csv", "synthetic-semicolon-decimal-comma.csv",
        "synthetic-tab-lbf-in.tsv", "synthetic-force-extension-only.csv"})
    void fingerprintIsTheSha256OfTheFileBytes(String name) throws Exception {
        byte[] file = resource(name);

        RawCurve curve = reader.read(file);

        assertThat(curve.sha256()).isEqualTo(jdkSha256(file));
        assertThat(curve.byteCount()).isEqualTo(file.length);
    }

    @Test
    void fingerprintKeepsByteOrderMarkAndCrlfInsteadOfANormalisedForm() throws Exception {
        byte[] withBomAndCrlf = resource("synthetic-semicolon-decimal-comma.csv");
        byte[] normalised = new String(withBomAndCrlf, StandardCharsets.UTF_8).replace("\uFEFF", "")
                .replace("\r\n", "\n").getBytes(StandardCharsets.UTF_8);

        RawCurve original = reader.read(withBomAndCrlf);
        RawCurve plain = reader.read(normalised);

        assertThat(withBomAndCrlf[0]).isEqualTo((byte) 0xEF);
        assertThat(original.forceN()).containsExactly(plain.forceN());
        assertThat(original.sha256()).isEqualTo(jdkSha256(withBomAndCrlf)).isNotEqualTo(plain.sha256());
        assertThat(original.byteCount()).isEqualTo(withBomAndCrlf.length).isGreaterThan(plain.byteCount());
    }

    @Test
    void jdkOracleMatchesTheFips180TestVectorForAbc() throws Exception {
        // FIPS 180-2 appendix B.1 test vector: SHA-256("abc"). Not a curve, so we check the oracle itself
        // against the standard before trusting it above.
        assertThat(jdkSha256(utf8("abc")))
                .isEqualTo("ba7816bf8f01cfea414140de5dae2223b00361a396177a9cb410ff61f20015ad");
    }

    @Test
    void fingerprintIsLowerCaseHexOf64Digits() {
        RawCurve curve = CurveFixtures.read("force [N],extension [mm]\n1,2\n");

        assertThat(curve.sha256()).matches("[0-9a-f]{64}");
    }

    @Test
    void fingerprintOfAStreamReadInManySmallPiecesIsTheSame() throws Exception {
        byte[] file = resource("synthetic-comma-kn.csv");

        assertThat(reader.read(new OneByteAtATime(file)).sha256()).isEqualTo(jdkSha256(file));
    }

    static String jdkSha256(byte[] bytes) throws NoSuchAlgorithmException {
        return HexFormat.of().formatHex(MessageDigest.getInstance("SHA-256").digest(bytes));
    }
}

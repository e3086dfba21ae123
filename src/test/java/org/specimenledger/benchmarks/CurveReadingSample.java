package org.specimenledger.benchmarks;

import java.io.ByteArrayOutputStream;
import java.nio.charset.StandardCharsets;

/**
 * A synthetic three-channel curve file for the curve reading benchmark: a smooth invented
 * force–extension shape with decimal values of realistic length (about 30 bytes per row), built
 * deterministically so every run reads the same bytes.
 */
final class CurveReadingSample {

    private CurveReadingSample() {
    }

    /**
     * Time in s (4 decimals), force in N (4 decimals), extension in mm (6 decimals); {@code points}
     * data rows after one header row, about 30 bytes per row.
     */
    static byte[] threeChannelCsv(int points) {
        ByteArrayOutputStream out = new ByteArrayOutputStream(points * 32);
        StringBuilder row = new StringBuilder(64);
        write(out, "time [s],force [N],extension [mm]\n");
        for (int i = 0; i < points; i++) {
            double time = i * 0.001;
            double extension = i * 0.00002;
            // Invented smooth shape: elastic rise, then saturating hardening; not any real material.
            double force = 45000.0 * (1.0 - Math.exp(-extension / 0.6)) + 0.123456 * (i % 97);
            row.setLength(0);
            row.append(round(time, 4)).append(',').append(round(force, 4)).append(',').append(round(extension, 6))
                    .append('\n');
            write(out, row.toString());
        }
        return out.toByteArray();
    }

    private static String round(double value, int decimals) {
        return java.math.BigDecimal.valueOf(value).setScale(decimals, java.math.RoundingMode.HALF_EVEN)
                .toPlainString();
    }

    private static void write(ByteArrayOutputStream out, String text) {
        byte[] bytes = text.getBytes(StandardCharsets.US_ASCII);
        out.write(bytes, 0, bytes.length);
    }
}

package org.specimenledger.reliability;

import java.nio.charset.StandardCharsets;
import java.util.ArrayList;
import java.util.Arrays;
import java.util.List;
import java.util.Random;

/**
 * Damaged curve files made from a good one: truncations, flipped and inserted bytes, broken cells, wrong
 * delimiters, impossible numbers, binary noise. Seeded, so a failure can be reproduced from its name.
 */
final class CurveCorruptions {

    /** One damaged file and what was done to it. */
    record Corrupted(String what, byte[] bytes) {
        @Override
        public String toString() {
            return what + " (" + bytes.length + " bytes)";
        }
    }

    private CurveCorruptions() {
    }

    static List<Corrupted> of(byte[] good, long seed, int randomCount) {
        String text = new String(good, StandardCharsets.UTF_8);
        List<Corrupted> out = new ArrayList<>();
        out.add(new Corrupted("empty", new byte[0]));
        out.add(new Corrupted("byte order mark only", new byte[] {(byte) 0xEF, (byte) 0xBB, (byte) 0xBF}));
        out.add(new Corrupted("header only", firstLines(text, 2)));
        out.add(new Corrupted("cut in the header", Arrays.copyOf(good, text.indexOf('\n') + 10)));
        out.add(new Corrupted("cut after 10 % of the bytes", Arrays.copyOf(good, good.length / 10)));
        out.add(new Corrupted("cut in the middle of a number", Arrays.copyOf(good, good.length / 2 + 3)));
        out.add(new Corrupted("NaN cells", replaceNth(text, ",", ",NaN,", 500)));
        out.add(new Corrupted("Infinity cells", replaceNth(text, ",", ",Infinity,", 700)));
        out.add(new Corrupted("1e400 cells", replaceNth(text, ",", ",1e400,", 900)));
        out.add(new Corrupted("negative extension everywhere", text.replace(",0.", ",-0.").getBytes(StandardCharsets.UTF_8)));
        out.add(new Corrupted("semicolons mixed with commas", replaceNth(text, ",", ";", 300)));
        out.add(new Corrupted("tab in one row", replaceNth(text, ",", "\t", 400)));
        out.add(new Corrupted("an extra cell", replaceNth(text, "\n", ",1.0\n", 600)));
        out.add(new Corrupted("a missing cell", replaceNth(text, ",", "", 800)));
        out.add(new Corrupted("NUL bytes in a row", replaceNth(text, ",", ",\u0000\u0000,", 650)));
        out.add(new Corrupted("header unit unknown", text.replace("force [kN]", "force [furlong]").getBytes(StandardCharsets.UTF_8)));
        out.add(new Corrupted("force column missing", text.replace("force [kN]", "load").getBytes(StandardCharsets.UTF_8)));
        out.add(new Corrupted("header twice", (firstLines(text, 2).length > 0 ? text + "time [s],force [kN],extension [mm]\n"
                : text).getBytes(StandardCharsets.UTF_8)));
        out.add(new Corrupted("latin-1 bytes in the header", latin1Header(good)));
        out.add(new Corrupted("one line of 2 MB without a newline", ("force [N],extension [mm]\n" + "1".repeat(2_000_000))
                .getBytes(StandardCharsets.UTF_8)));
        out.add(new Corrupted("CR-only line ends", text.replace("\n", "\r").getBytes(StandardCharsets.UTF_8)));
        out.add(new Corrupted("all zero force", zeroForce(text)));
        Random random = new Random(seed);
        byte[] noise = new byte[4096];
        random.nextBytes(noise);
        out.add(new Corrupted("binary noise, seed " + seed, noise));
        for (int i = 0; i < randomCount; i++) {
            byte[] b = good.clone();
            int flips = 1 + random.nextInt(8);
            for (int f = 0; f < flips; f++) {
                b[random.nextInt(b.length)] = (byte) random.nextInt(256);
            }
            out.add(new Corrupted("seed " + seed + " #" + i + ": " + flips + " random bytes overwritten", b));
            int cut = random.nextInt(b.length);
            out.add(new Corrupted("seed " + seed + " #" + i + ": cut at byte " + cut, Arrays.copyOf(good, cut)));
        }
        return out;
    }

    private static byte[] firstLines(String text, int lines) {
        int at = -1;
        for (int i = 0; i < lines; i++) {
            at = text.indexOf('\n', at + 1);
            if (at < 0) {
                return text.getBytes(StandardCharsets.UTF_8);
            }
        }
        return text.substring(0, at + 1).getBytes(StandardCharsets.UTF_8);
    }

    private static byte[] replaceNth(String text, String what, String with, int n) {
        int at = -1;
        for (int i = 0; i <= n; i++) {
            int next = text.indexOf(what, at + 1);
            if (next < 0) {
                break;
            }
            at = next;
        }
        if (at < 0) {
            return text.getBytes(StandardCharsets.UTF_8);
        }
        return (text.substring(0, at) + with + text.substring(at + what.length())).getBytes(StandardCharsets.UTF_8);
    }

    private static byte[] latin1Header(byte[] good) {
        String text = new String(good, StandardCharsets.UTF_8).replace("force [kN]", "Kraft [kN] \u00e4");
        return text.getBytes(StandardCharsets.ISO_8859_1);
    }

    private static byte[] zeroForce(String text) {
        StringBuilder sb = new StringBuilder();
        for (String line : text.split("\n", -1)) {
            String[] cells = line.split(",", -1);
            if (cells.length == 3 && !cells[0].startsWith("#") && !cells[0].startsWith("time")) {
                sb.append(cells[0]).append(",0,").append(cells[2]).append('\n');
            } else if (!line.isEmpty()) {
                sb.append(line).append('\n');
            }
        }
        return sb.toString().getBytes(StandardCharsets.UTF_8);
    }
}

package org.specimenledger.testsupport;

import static org.assertj.core.api.Assertions.assertThat;

import java.io.ByteArrayInputStream;
import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.zip.ZipEntry;
import java.util.zip.ZipInputStream;

/** Unpacks a downloaded zip (an audit bundle) into a folder, as an outside checker would, refusing entries that leave it. */
public final class Zips {

    private Zips() {
    }

    public static void unzip(byte[] zip, Path to) throws IOException {
        try (ZipInputStream in = new ZipInputStream(new ByteArrayInputStream(zip), StandardCharsets.UTF_8)) {
            for (ZipEntry e; (e = in.getNextEntry()) != null; ) {
                Path target = to.resolve(e.getName()).normalize();
                assertThat(target.startsWith(to)).isTrue();
                Files.createDirectories(target.getParent());
                Files.write(target, in.readAllBytes());
            }
        }
    }
}

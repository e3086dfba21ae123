package org.specimenledger.trace;

import java.io.IOException;
import java.io.OutputStream;
import java.nio.charset.StandardCharsets;
import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.LinkedHashSet;
import java.util.List;
import java.util.Map;
import java.util.Set;
import java.util.UUID;
import java.util.zip.ZipEntry;
import java.util.zip.ZipOutputStream;
import org.specimenledger.audit.InclusionProof;
import org.specimenledger.testing.CalibrationUsed;
import org.specimenledger.testing.RawCurveView;
import org.springframework.stereotype.Component;
import tools.jackson.databind.SerializationFeature;
import tools.jackson.databind.json.JsonMapper;

/**
 * Writes an {@link AuditBundle} as a zip:
 * <pre>
 * VERIFY.txt                      how to check everything (and a bash script doing exactly that)
 * public-key.pem                  the checkpoint signing key (X.509 SubjectPublicKeyInfo)
 * checkpoint/signed-text.txt      the signed checkpoint text, byte for byte
 * checkpoint/signature.bin        its 64-byte Ed25519 signature
 * checkpoint/checkpoint.json      the checkpoint as the API gives it
 * events/&lt;seq&gt;.json              each event's canonical text, byte for byte (its SHA-256 is the event hash)
 * proofs/&lt;seq&gt;.txt               leaf index, tree size, audit path (one lower-case hex hash a line)
 * records/&lt;type&gt;-&lt;id&gt;.json       each record's latest state exactly as its event recorded it
 * curves/&lt;raw curve id&gt;-&lt;name&gt;    the raw curve files exactly as uploaded
 * replays/&lt;analysis id&gt;.json      this software's replay of each analysis at export (not signed)
 * trace.json                      the trace, as GET /api/v1/trace/... answers it
 * document.pdf                    the root document, when one is given
 * </pre>
 */
@Component
class AuditBundleWriter {

    private final JsonMapper json;
    private final String softwareVersion;

    AuditBundleWriter(JsonMapper json, org.springframework.beans.factory.ObjectProvider<
            org.springframework.boot.info.BuildProperties> build) {
        this.json = json.rebuild().enable(SerializationFeature.INDENT_OUTPUT).build();
        var b = build.getIfAvailable();
        this.softwareVersion = b == null || b.getVersion() == null ? "(version unknown)" : b.getVersion();
    }

    void write(AuditBundle b, OutputStream out) throws IOException {
        Map<String, byte[]> files = new LinkedHashMap<>();
        files.put("public-key.pem", utf8(b.publicKeyPem()));
        files.put("checkpoint/signed-text.txt", b.checkpoint().signedBytes());
        files.put("checkpoint/signature.bin", b.checkpoint().signatureBytes());
        files.put("checkpoint/checkpoint.json", json.writeValueAsBytes(b.checkpoint()));
        for (AuditBundle.ProvenEvent e : b.events()) {
            files.put("events/" + e.event().seq() + ".json", utf8(e.event().canonical()));
            files.put("proofs/" + e.event().seq() + ".txt", utf8(proofText(e.proof())));
        }
        Map<String, Long> recordEvents = new LinkedHashMap<>();
        Set<String> recordPaths = new LinkedHashSet<>();
        for (AuditBundle.Record r : b.records()) {
            String path = "records/" + r.type() + "-" + r.id() + ".json";
            files.put(path, utf8(r.json()));
            recordEvents.put(path, r.seq());
            recordPaths.add(path);
        }
        List<VerifyScript.CurveFile> curves = new ArrayList<>();
        List<VerifyScript.Link> links = new ArrayList<>();
        Map<UUID, List<UUID>> analysesOfCurve = new LinkedHashMap<>();
        for (TraceView.LineTrace line : b.trace().lines()) {
            UUID analysis = line.analysis().record().id();
            UUID curve = line.analysis().record().rawCurveId();
            analysesOfCurve.computeIfAbsent(curve, k -> new ArrayList<>()).add(analysis);
            String a = path(TraceService.ANALYSIS, analysis);
            String run = path(TraceService.TEST_RUN, line.testRun().record().id());
            String specimen = path(TraceService.SPECIMEN, line.specimen().record().id());
            link(links, recordPaths, a, "testRunId", line.testRun().record().id());
            link(links, recordPaths, a, "rawCurveId", curve);
            link(links, recordPaths, run, "specimenId", line.specimen().record().id());
            if (line.heat() != null) {
                link(links, recordPaths, specimen, "heatId", line.heat().record().id());
            }
            for (CalibrationUsed used : line.analysis().record().calibrations()) {
                if (used.calibrationId() != null) {
                    link(links, recordPaths, a, "calibrationId", used.calibrationId());
                    link(links, recordPaths, path(TraceService.CALIBRATION, used.calibrationId()), "equipmentId",
                            used.equipmentId());
                }
            }
            files.put("replays/" + analysis + ".json", json.writeValueAsBytes(line.replay()));
        }
        for (TraceView.LineTrace line : b.trace().lines()) {
            RawCurveView c = line.rawCurve().record();
            String path = "curves/" + c.id() + "-" + safeName(c.originalName());
            if (!files.containsKey(path)) {
                files.put(path, b.curves().get(c.id()));
                curves.add(new VerifyScript.CurveFile(path, c.id(), analysesOfCurve.get(c.id())));
            }
        }
        files.put("trace.json", json.writeValueAsBytes(b.trace()));
        String document = null;
        if (b.root() != null && b.root().documentPdf() != null) {
            document = "document.pdf";
            files.put(document, b.root().documentPdf());
        }
        String verify = VerifyScript.write(b, recordEvents, curves, links, document, softwareVersion);

        ZipOutputStream zip = new ZipOutputStream(out, StandardCharsets.UTF_8);
        entry(zip, "VERIFY.txt", utf8(verify));
        for (Map.Entry<String, byte[]> f : files.entrySet()) {
            entry(zip, f.getKey(), f.getValue());
        }
        zip.finish();
    }

    private static void link(List<VerifyScript.Link> links, Set<String> present, String from, String key, UUID to) {
        VerifyScript.Link l = new VerifyScript.Link(from, key, to.toString());
        if (present.contains(from) && !links.contains(l)) {
            links.add(l);
        }
    }

    private static String path(String type, UUID id) {
        return "records/" + type + "-" + id + ".json";
    }

    static String proofText(InclusionProof p) {
        StringBuilder s = new StringBuilder().append(p.leafIndex()).append('\n').append(p.treeSize()).append('\n');
        p.auditPath().forEach(h -> s.append(h).append('\n'));
        return s.toString();
    }

    /** A file name safe in any shell and file system: letters, digits, dot, dash and underscore. */
    static String safeName(String original) {
        if (original == null || original.isBlank()) {
            return "curve.csv";
        }
        String name = original.replaceAll(".*[/\\\\]", "").replaceAll("[^A-Za-z0-9._-]", "_");
        name = name.replaceAll("^[.-]+", "");
        if (name.length() > 80) {
            name = name.substring(name.length() - 80);
        }
        return name.isEmpty() ? "curve.csv" : name;
    }

    private static void entry(ZipOutputStream zip, String name, byte[] bytes) throws IOException {
        zip.putNextEntry(new ZipEntry(name));
        zip.write(bytes);
        zip.closeEntry();
    }

    private static byte[] utf8(String s) {
        return s.getBytes(StandardCharsets.UTF_8);
    }
}

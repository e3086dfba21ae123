package org.specimenledger.testing;

import java.io.IOException;
import java.io.InputStream;
import java.io.OutputStream;
import java.io.UncheckedIOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.Comparator;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.UUID;
import java.util.stream.Stream;
import java.util.zip.ZipEntry;
import java.util.zip.ZipException;
import java.util.zip.ZipInputStream;
import org.specimenledger.customers.CustomerDirectory;
import org.specimenledger.jobs.JobProgress;
import org.specimenledger.jobs.JobView;
import org.specimenledger.jobs.Jobs;
import org.specimenledger.shared.RecordNotFound;
import org.specimenledger.shared.RuleViolation;
import org.specimenledger.specimens.SpecimenDirectory;
import org.specimenledger.specimens.SpecimenView;
import org.springframework.stereotype.Service;

/**
 * Many curve files of one order at once, as a zip. The zip is checked and its entries written to a spool folder
 * while the request is read (so nothing waits on the network later); then a job takes each entry through the
 * very path of a single upload ({@link CurveIntake}, its checks, its transaction and its ledger events), so a
 * failed entry is reported with its reason and the others go on.
 *
 * <p>Matching rule: an entry's file name without folders and without its last extension is a specimen mark of
 * the order (ignoring case), and the curve goes to that specimen's valid test run: {@code SP-0412.csv} →
 * specimen {@code SP-0412}. Refused as a whole, before any job: names that are absolute, climb with
 * {@code ..}, use a backslash, a drive letter or control characters; more entries, or more inflated bytes
 * per entry or in all, than {@link CurveBatchSettings} allows (counted on the bytes inflated, not on the sizes
 * the zip claims); a zip that cannot be read or holds no file.
 */
@Service
class CurveBatch {

    private static final org.slf4j.Logger log = org.slf4j.LoggerFactory.getLogger(CurveBatch.class);

    static final String KIND = "curve-batch";

    /** One spooled entry, in zip order. */
    record Entry(int index, String name, String fileName, Path file, long size) {
    }

    private final CurveIntake intake;
    private final SpecimenDirectory specimens;
    private final TestRunDirectory runs;
    private final CustomerDirectory customers;
    private final Jobs jobs;
    private final CurveBatchSettings settings;

    CurveBatch(CurveIntake intake, SpecimenDirectory specimens, TestRunDirectory runs, CustomerDirectory customers,
            Jobs jobs, CurveBatchSettings settings) {
        this.intake = intake;
        this.specimens = specimens;
        this.runs = runs;
        this.customers = customers;
        this.jobs = jobs;
        this.settings = settings;
    }

    JobView receive(UUID orderId, InputStream zip, long contentLength) {
        if (customers.order(orderId).isEmpty()) {
            throw new RecordNotFound("order", orderId);
        }
        long total = settings.maxTotalSize().toBytes();
        if (contentLength > total) {
            throw new CurveTooLarge("the zip has " + contentLength + " bytes, above the limit of " + total
                    + " bytes", total);
        }
        Path folder;
        try {
            Files.createDirectories(settings.spoolFolder());
            folder = Files.createTempDirectory(settings.spoolFolder(), "batch-");
        } catch (IOException e) {
            throw new UncheckedIOException("the spool folder for curve batches cannot be written", e);
        }
        List<Entry> entries;
        try {
            entries = spool(zip, folder);
        } catch (RuntimeException refused) {
            delete(folder);
            throw refused;
        }
        try {
            return jobs.submit(KIND, entries.size() + " curve files for order " + orderId, entries.size(), null,
                    progress -> work(orderId, entries, folder, progress));
        } catch (RuntimeException refused) {
            delete(folder);
            throw refused;
        }
    }

    private List<Entry> spool(InputStream body, Path folder) {
        long perEntry = settings.maxEntrySize().toBytes();
        long total = settings.maxTotalSize().toBytes();
        long inflated = 0;
        int count = 0;
        List<Entry> entries = new ArrayList<>();
        byte[] buffer = new byte[64 * 1024];
        try (ZipInputStream zip = new ZipInputStream(body)) {
            ZipEntry e;
            while ((e = zip.getNextEntry()) != null) {
                count++;
                if (count > settings.maxEntries()) {
                    throw new RuleViolation("/entries", "a batch holds at most " + settings.maxEntries()
                            + " entries (folders included)");
                }
                String name = e.getName();
                String problem = nameProblem(name);
                if (problem != null) {
                    throw new RuleViolation("/entries/" + (count - 1), "entry " + count + " is refused: " + problem);
                }
                if (e.isDirectory()) {
                    continue;
                }
                Path file = folder.resolve(String.format(Locale.ROOT, "entry-%05d", entries.size()));
                long size = 0;
                try (OutputStream out = Files.newOutputStream(file)) {
                    int n;
                    while ((n = zip.read(buffer)) > 0) {
                        size += n;
                        inflated += n;
                        if (size > perEntry) {
                            throw new CurveTooLarge("entry '" + name + "' inflates to more than " + perEntry
                                    + " bytes, the limit for one curve file", perEntry);
                        }
                        if (inflated > total) {
                            throw new CurveTooLarge("the entries inflate to more than " + total
                                    + " bytes together, the limit for one batch", total);
                        }
                        out.write(buffer, 0, n);
                    }
                }
                entries.add(new Entry(entries.size(), name, name.substring(name.lastIndexOf('/') + 1), file, size));
            }
        } catch (ZipException bad) {
            throw new RuleViolation("/", "not a readable zip file: " + bad.getMessage());
        } catch (IOException e) {
            throw new UncheckedIOException("reading the zip failed", e);
        }
        if (entries.isEmpty()) {
            throw new RuleViolation("/", "the zip holds no file");
        }
        return entries;
    }

    /** Why an entry name is refused, or null when it is a plain relative name. */
    static String nameProblem(String name) {
        if (name == null || name.isEmpty()) {
            return "it has no name";
        }
        for (int i = 0; i < name.length(); i++) {
            if (Character.isISOControl(name.charAt(i))) {
                return "its name has a control character";
            }
        }
        if (name.indexOf('\\') >= 0) {
            return "its name '" + name + "' has a backslash";
        }
        if (name.startsWith("/") || (name.length() > 1 && name.charAt(1) == ':')) {
            return "its name '" + name + "' is an absolute path";
        }
        for (String segment : name.split("/", -1)) {
            if (segment.equals("..") || segment.equals(".")) {
                return "its name '" + name + "' climbs out of the zip with '" + segment + "'";
            }
        }
        return null;
    }

    /** The specimen mark an entry's file name stands for: the name without its last extension. */
    static String markOf(String fileName) {
        int dot = fileName.lastIndexOf('.');
        return dot > 0 ? fileName.substring(0, dot) : fileName;
    }

    private Map<String, Object> work(UUID orderId, List<Entry> entries, Path folder, JobProgress progress) {
        try {
            for (Entry entry : entries) {
                Map<String, Object> item = new LinkedHashMap<>();
                item.put("entry", entry.name());
                String mark = markOf(entry.fileName());
                item.put("mark", mark);
                try {
                    SpecimenView specimen = specimens.inOrderWithMark(orderId, mark).orElseThrow(() ->
                            new NotMatched("no specimen marked '" + mark + "' in order " + orderId));
                    item.put("specimenId", specimen.id());
                    TestRunView run = runs.validRunOf(specimen.id()).orElseThrow(() -> new NotMatched(
                            "specimen '" + specimen.labIdentifier() + "' has no valid test run; register one first"));
                    item.put("testRunId", run.id());
                    CurveIntake.Received received;
                    try (InputStream in = Files.newInputStream(entry.file())) {
                        received = intake.receive(run.id(), new CurveIntake.Upload(in, entry.size(),
                                mediaType(entry.fileName()), entry.fileName(), false, null));
                    }
                    item.put("rawCurveId", received.curve().id());
                    item.put("sha256", received.curve().sha256());
                    item.put("analysisId", received.analysis().id());
                    progress.succeeded(item);
                } catch (RuntimeException refused) {
                    String slug = slugOf(refused);
                    item.put("problem", slug);
                    item.put("detail", slug.equals("internal") ? "internal error; the service log has the details"
                            : refused.getMessage());
                    if (slug.equals("internal")) {
                        log.error("curve batch entry {} failed", entry.name(), refused);
                    }
                    progress.failed(item);
                } finally {
                    Files.deleteIfExists(entry.file());
                }
            }
            Map<String, Object> answer = new LinkedHashMap<>();
            answer.put("orderId", orderId);
            answer.put("entries", entries.size());
            return answer;
        } catch (IOException e) {
            throw new UncheckedIOException(e);
        } finally {
            delete(folder);
        }
    }

    /** An entry that names no specimen of the order, or one without a valid test run. */
    static final class NotMatched extends RuntimeException {
        NotMatched(String message) {
            super(message);
        }
    }

    /** The problem type an entry's failure would have had as a single upload (the slugs of the problem responses). */
    static String slugOf(RuntimeException e) {
        if (e instanceof NotMatched) {
            return "no-match";
        }
        if (e instanceof org.specimenledger.curve.CurveRejected) {
            return "curve-rejected";
        }
        if (e instanceof org.specimenledger.analysis.AnalysisRejected) {
            return "analysis-rejected";
        }
        if (e instanceof DuplicateCurve) {
            return "duplicate-curve";
        }
        if (e instanceof CurveTooLarge) {
            return "curve-too-large";
        }
        if (e instanceof CalibrationNotValid) {
            return "calibration-not-valid";
        }
        if (e instanceof org.specimenledger.shared.StateConflict) {
            return "state-conflict";
        }
        if (e instanceof RuleViolation) {
            return "rule-violated";
        }
        if (e instanceof RecordNotFound) {
            return "not-found";
        }
        return "internal";
    }

    private static String mediaType(String fileName) {
        String lower = fileName.toLowerCase(Locale.ROOT);
        if (lower.endsWith(".csv")) {
            return "text/csv";
        }
        if (lower.endsWith(".tsv")) {
            return "text/tab-separated-values";
        }
        return lower.endsWith(".txt") ? "text/plain" : "application/octet-stream";
    }

    private static void delete(Path folder) {
        try (Stream<Path> files = Files.walk(folder)) {
            files.sorted(Comparator.reverseOrder()).forEach(p -> p.toFile().delete());
        } catch (IOException ignored) {
            // a spool folder left behind holds only copies of what the client sent
        }
    }
}

package org.specimenledger.reliability;

import java.util.ArrayList;
import java.util.List;
import java.util.Set;
import tools.jackson.databind.JsonNode;

/**
 * A place where accepted text is shown to someone, and the check that it arrives there as text, never as
 * markup or script. Places: the JSON answer itself ({@link #JSON}), and the pages that show the record the
 * request created ({@link #pages}), read back with an HTML5 parser ({@link PageChecks}). PDFs and the results CSV
 * need a whole chain of records (an issued certificate, an analysed run) rather than one accepted request:
 * {@link HostileTextRenderingTest} fills every field of such a chain with the same texts and reads the PDF back
 * with PDFBox and the CSV with Commons CSV.
 */
interface RenderedText {

    /** A text the service accepted: the endpoint ("POST /api/v1/specimens"), the field's JSON pointer, the answer. */
    record Accepted(String endpoint, String pointer, String text, Wire.Answer answer) {
    }

    /** What the place is, for the failure message. */
    String name();

    /** Null when the accepted text is rendered safely at this place; else why not. */
    String check(Accepted accepted);

    /** JSON answers: served as JSON with {@code nosniff}, and the body parses (so every string is escaped). */
    RenderedText JSON = new RenderedText() {
        @Override
        public String name() {
            return "in the JSON answer";
        }

        @Override
        public String check(Accepted accepted) {
            Wire.Answer answer = accepted.answer();
            if (answer.body() == null || answer.body().isEmpty()) {
                return null;
            }
            if (!answer.contentType().startsWith("application/json")) {
                return "served as '" + answer.contentType() + "'";
            }
            if (!"nosniff".equals(answer.headers().firstValue("X-Content-Type-Options").orElse(null))) {
                return "served without X-Content-Type-Options: nosniff";
            }
            try {
                JsonNode ignored = answer.json();
            } catch (RuntimeException e) {
                return "the body is not valid JSON";
            }
            return null;
        }
    };

    /**
     * A page that shows records of one kind: its path made from the created record's answer, and the fields
     * (JSON pointers of the request) the page prints, so that their text must be found there as text.
     */
    record PageOf(String endpoint, String idMember, String path, Set<String> shown) {

        String pathFor(JsonNode created) {
            if (idMember == null) {
                return path;
            }
            JsonNode id = created == null ? null : created.get(idMember);
            return id == null || !id.isString() ? null : path.replace("{id}", id.asString());
        }
    }

    /** The lab pages that show what the corpus's accepted requests create, read as the lab manager. */
    List<PageOf> PAGES_OF = List.of(
            new PageOf("POST /api/v1/specimens", "id", "/lab/specimens/{id}", Set.of("/labIdentifier")),
            new PageOf("POST /api/v1/specimens", null, "/lab", Set.of("/labIdentifier")),
            new PageOf("POST /api/v1/tests", "id", "/lab/tests/{id}", Set.of()),
            new PageOf("POST /api/v1/tests/{id}/analyses", "testRunId", "/lab/tests/{id}", Set.of("/reason")),
            new PageOf("POST /api/v1/customers/{id}/orders", null, "/lab/certificates",
                    Set.of("/purchaseOrder", "/materialSpecification")),
            new PageOf("POST /api/v1/customers/{id}/orders", null, "/lab/jobs",
                    Set.of("/purchaseOrder", "/materialSpecification")),
            new PageOf("POST /api/v1/equipment", null, "/lab/equipment", Set.of("/assetId", "/description")));

    /** The pages place: every page of {@link #PAGES_OF} for the endpoint, read by {@code reader}. */
    static RenderedText pages(PageVisitor reader) {
        return new RenderedText() {
            @Override
            public String name() {
                return "on its pages";
            }

            @Override
            public String check(Accepted accepted) {
                List<String> problems = new ArrayList<>();
                for (PageOf page : PAGES_OF) {
                    if (!page.endpoint().equals(accepted.endpoint())) {
                        continue;
                    }
                    String path = page.pathFor(accepted.answer().json());
                    if (path == null) {
                        problems.add(page.path() + ": the answer has no " + page.idMember());
                        continue;
                    }
                    // the services store what was typed without its surrounding white space
                    problems.addAll(PageChecks.problems(reader.get(path), accepted.text().trim(),
                            page.shown().contains(accepted.pointer())));
                }
                return problems.isEmpty() ? null : String.join("; ", problems);
            }
        };
    }

    /** Every place, with the pages read by {@code reader}. */
    static List<RenderedText> places(PageVisitor reader) {
        return List.of(JSON, pages(reader));
    }

}

package org.specimenledger.specimens;

import java.io.IOException;
import java.io.Reader;
import java.io.StringReader;
import java.math.BigDecimal;
import java.nio.ByteBuffer;
import java.nio.charset.CharacterCodingException;
import java.nio.charset.CodingErrorAction;
import java.nio.charset.StandardCharsets;
import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.UUID;
import org.apache.commons.csv.CSVFormat;
import org.apache.commons.csv.CSVParser;
import org.apache.commons.csv.CSVRecord;
import org.specimenledger.shared.FieldIssue;

/**
 * The column layout of a specimen import file, and its reading into one {@link SpecimenRequests.SpecimenRequest}
 * per row. The layout is this project's own:
 *
 * <pre>
 *   mark, heat, orientation, shape, position, diameter, thickness, width, outer_diameter, area, area_method,
 *   k, l0, round_l0, le, lc, note
 * </pre>
 *
 * UTF-8 (a BOM is allowed), comma-separated, first line the header; header names ignore case, any order,
 * unknown names are refused. {@code mark}, {@code heat}, {@code orientation}, {@code shape}, {@code le},
 * {@code lc} and one of {@code k} / {@code l0} are needed. Lengths in mm, area in mm². A dimension cell holds
 * all its readings separated by spaces ({@code "10.00 10.01 10.00"}): {@code diameter} is d of a ROUND piece,
 * {@code thickness} is a (FLAT thickness, TUBE wall), {@code width} is b, {@code outer_diameter} is D;
 * {@code area} and {@code area_method} are for OTHER. {@code heat} is the heat number (or the heat's id when the
 * number is used by more than one producer). Blank lines are skipped.
 *
 * <p>Rows are numbered from 1 for the first line under the header; a problem's pointer is
 * {@code /rows/{row}/{column}}, or {@code /header/{column}} for the header.
 */
final class SpecimenSheet {

    /** More rows than this are refused as a whole: one order does not hold them. */
    static final int MAX_ROWS = 2000;

    static final List<String> COLUMNS = List.of("mark", "heat", "orientation", "shape", "position", "diameter",
            "thickness", "width", "outer_diameter", "area", "area_method", "k", "l0", "round_l0", "le", "lc", "note");
    private static final List<String> REQUIRED = List.of("mark", "heat", "orientation", "shape", "le", "lc");

    /** One data row as read: its number, its cells by column, and the request built from them. */
    record Row(int number, long line, Map<String, String> cells, String heat, SpecimenRequests.SpecimenRequest request) {
    }

    /** The rows that could be built, and every problem found while reading. */
    record Read(List<Row> rows, List<FieldIssue> issues) {
    }

    private SpecimenSheet() {
    }

    static Read read(byte[] bytes, UUID orderId) {
        List<FieldIssue> issues = new ArrayList<>();
        String text;
        try {
            text = StandardCharsets.UTF_8.newDecoder().onMalformedInput(CodingErrorAction.REPORT)
                    .onUnmappableCharacter(CodingErrorAction.REPORT).decode(ByteBuffer.wrap(bytes)).toString();
        } catch (CharacterCodingException e) {
            return new Read(List.of(), List.of(new FieldIssue("/", "the file is not UTF-8 text")));
        }
        if (text.startsWith("\uFEFF")) {
            text = text.substring(1);
        }
        CSVFormat format = CSVFormat.RFC4180.builder().setHeader().setSkipHeaderRecord(true)
                .setIgnoreEmptyLines(true).setTrim(true).setAllowMissingColumnNames(false).get();
        List<Row> rows = new ArrayList<>();
        try (Reader reader = new StringReader(text); CSVParser parser = CSVParser.parse(reader, format)) {
            Map<String, String> columnOf = header(parser.getHeaderNames(), issues);
            if (!issues.isEmpty()) {
                return new Read(List.of(), issues);
            }
            int number = 0;
            for (CSVRecord record : parser) {
                number++;
                if (number > MAX_ROWS) {
                    return new Read(List.of(), List.of(new FieldIssue("/rows", "at most " + MAX_ROWS
                            + " rows in one import")));
                }
                if (!record.isConsistent()) {
                    issues.add(new FieldIssue("/rows/" + number, "row " + number + " (line "
                            + record.getParser().getCurrentLineNumber() + ") has " + record.size()
                            + " cells, the header " + columnOf.size()));
                    continue;
                }
                Map<String, String> cells = new LinkedHashMap<>();
                columnOf.forEach((given, column) -> {
                    String v = record.get(given);
                    cells.put(column, v == null || v.isBlank() ? null : v.trim());
                });
                rows.add(row(number, record.getParser().getCurrentLineNumber(), cells, orderId, issues));
            }
        } catch (IOException | IllegalArgumentException | IllegalStateException e) {
            // commons-csv reports a malformed quote or a duplicate header this way, with the line in its message
            issues.add(new FieldIssue("/", "not a readable CSV file: " + e.getMessage()));
        }
        if (rows.isEmpty() && issues.isEmpty()) {
            issues.add(new FieldIssue("/rows", "the file has a header but no rows"));
        }
        return new Read(rows, issues);
    }

    /** Given header name → column of the layout; every unknown, repeated or missing column is an issue. */
    private static Map<String, String> header(List<String> names, List<FieldIssue> issues) {
        Map<String, String> columnOf = new LinkedHashMap<>();
        for (String given : names) {
            String column = given == null ? "" : given.trim().toLowerCase(Locale.ROOT);
            if (!COLUMNS.contains(column)) {
                issues.add(new FieldIssue("/header/" + escape(given), "unknown column '" + given + "'; the columns are "
                        + String.join(", ", COLUMNS)));
            } else if (columnOf.containsValue(column)) {
                issues.add(new FieldIssue("/header/" + column, "column '" + column + "' appears twice"));
            } else {
                columnOf.put(given, column);
            }
        }
        for (String required : REQUIRED) {
            if (!columnOf.containsValue(required)) {
                issues.add(new FieldIssue("/header/" + required, "column '" + required + "' is required"));
            }
        }
        return columnOf;
    }

    private static Row row(int number, long line, Map<String, String> cells, UUID orderId, List<FieldIssue> issues) {
        String at = "/rows/" + number + "/";
        Orientation orientation = choice(Orientation.class, cells.get("orientation"), at + "orientation", issues);
        SpecimenShape shape = choice(SpecimenShape.class, cells.get("shape"), at + "shape", issues);
        Map<String, List<BigDecimal>> readings = new LinkedHashMap<>();
        readings(cells, "diameter", "d", at, readings, issues);
        readings(cells, "thickness", "a", at, readings, issues);
        readings(cells, "width", "b", at, readings, issues);
        readings(cells, "outer_diameter", "D", at, readings, issues);
        BigDecimal k = number(cells.get("k"), at + "k", issues);
        BigDecimal l0 = number(cells.get("l0"), at + "l0", issues);
        Boolean roundL0 = yesNo(cells.get("round_l0"), at + "round_l0", issues);
        GaugeLength.Basis basis = l0 != null && k == null ? GaugeLength.Basis.FIXED : GaugeLength.Basis.PROPORTIONAL;
        if (k == null && l0 == null && cells.get("k") == null && cells.get("l0") == null) {
            issues.add(new FieldIssue(at + "k", "give k (5.65 or 11.3) for a proportional gauge length or l0 (mm) for "
                    + "a fixed one"));
        }
        SpecimenRequests.SpecimenRequest request = new SpecimenRequests.SpecimenRequest(cells.get("mark"), null,
                orderId, orientation, cells.get("position"), shape, readings.isEmpty() ? null : readings,
                number(cells.get("area"), at + "area", issues), cells.get("area_method"),
                new SpecimenRequests.GaugeLengthRequest(basis, k, roundL0, l0),
                number(cells.get("le"), at + "le", issues), number(cells.get("lc"), at + "lc", issues),
                cells.get("note"));
        return new Row(number, line, cells, cells.get("heat"), request);
    }

    private static void readings(Map<String, String> cells, String column, String symbol, String at,
            Map<String, List<BigDecimal>> out, List<FieldIssue> issues) {
        String cell = cells.get(column);
        if (cell == null) {
            return;
        }
        List<BigDecimal> values = new ArrayList<>();
        for (String token : cell.split("\\s+")) {
            BigDecimal v = number(token, at + column, issues);
            if (v == null) {
                return;
            }
            values.add(v);
        }
        out.put(symbol, values);
    }

    private static BigDecimal number(String cell, String pointer, List<FieldIssue> issues) {
        if (cell == null) {
            return null;
        }
        try {
            return new BigDecimal(cell);
        } catch (NumberFormatException e) {
            issues.add(new FieldIssue(pointer, "'" + cell + "' is not a number (use a point as decimal mark)"));
            return null;
        }
    }

    private static Boolean yesNo(String cell, String pointer, List<FieldIssue> issues) {
        if (cell == null) {
            return null;
        }
        return switch (cell.toLowerCase(Locale.ROOT)) {
            case "yes", "true" -> Boolean.TRUE;
            case "no", "false" -> Boolean.FALSE;
            default -> {
                issues.add(new FieldIssue(pointer, "'" + cell + "' must be yes or no"));
                yield null;
            }
        };
    }

    private static <E extends Enum<E>> E choice(Class<E> type, String cell, String pointer, List<FieldIssue> issues) {
        if (cell == null) {
            return null; // reported as missing by the specimen rules
        }
        try {
            return Enum.valueOf(type, cell.toUpperCase(Locale.ROOT));
        } catch (IllegalArgumentException e) {
            List<String> allowed = new ArrayList<>();
            for (E c : type.getEnumConstants()) {
                allowed.add(c.name());
            }
            issues.add(new FieldIssue(pointer, "'" + cell + "' is not one of " + String.join(", ", allowed)));
            return null;
        }
    }

    /** The sheet column a pointer into the JSON request corresponds to, for the shape of the row. */
    static String columnOf(String requestPointer, SpecimenShape shape) {
        String p = requestPointer == null ? "" : requestPointer;
        if (p.startsWith("/readings/")) {
            String symbol = p.substring("/readings/".length()).split("/")[0];
            return switch (symbol) {
                case "d" -> "diameter";
                case "a" -> "thickness";
                case "b" -> "width";
                case "D" -> "outer_diameter";
                default -> symbol;
            };
        }
        return switch (p) {
            case "/labIdentifier" -> "mark";
            case "/heatId" -> "heat";
            case "/orientation" -> "orientation";
            case "/shape" -> "shape";
            case "/samplingPosition" -> "position";
            case "/s0Mm2" -> "area";
            case "/s0Method" -> "area_method";
            case "/gaugeLength/k", "/gaugeLength", "/gaugeLength/basis" -> "k";
            case "/gaugeLength/l0Mm" -> "l0";
            case "/gaugeLength/roundToFiveMm" -> "round_l0";
            case "/leMm" -> "le";
            case "/lcMm" -> "lc";
            case "/reason" -> "note";
            case "/readings" -> shape == SpecimenShape.ROUND ? "diameter" : "thickness";
            default -> p.isEmpty() ? "" : p.substring(1);
        };
    }

    /** JSON Pointer escaping of one reference token (RFC 6901 §3). */
    static String escape(String token) {
        return String.valueOf(token).replace("~", "~0").replace("/", "~1");
    }
}

package org.specimenledger.web;

import java.math.BigDecimal;
import java.time.LocalDate;
import java.time.format.DateTimeParseException;
import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import java.util.UUID;
import org.specimenledger.shared.FieldIssue;

/** Turns typed form text into values, adding a problem (by JSON Pointer) for text that is not one. */
final class FormValues {

    private FormValues() {
    }

    static String text(String s) {
        return s == null || s.isBlank() ? null : s.trim();
    }

    /** A decimal number; a comma is accepted as the decimal mark. Blank is null (the rules say if required). */
    static BigDecimal number(String s, String pointer, List<FieldIssue> problems) {
        String t = text(s);
        if (t == null) {
            return null;
        }
        try {
            return new BigDecimal(t.replace(',', '.'));
        } catch (NumberFormatException e) {
            problems.add(new FieldIssue(pointer, "'" + t + "' is not a number"));
            return null;
        }
    }

    /** Numbers separated by spaces or semicolons. */
    static List<BigDecimal> numbers(String s, String pointer, List<FieldIssue> problems) {
        String t = text(s);
        if (t == null) {
            return null;
        }
        List<BigDecimal> out = new ArrayList<>();
        for (String part : t.split("[\\s;]+")) {
            BigDecimal v = number(part, pointer, problems);
            if (v != null) {
                out.add(v);
            }
        }
        return out;
    }

    /** A calendar date as ISO 8601 writes it (2026-03-09), the form a date input sends. Blank is null. */
    static LocalDate date(String s, String pointer, List<FieldIssue> problems) {
        String t = text(s);
        if (t == null) {
            return null;
        }
        try {
            return LocalDate.parse(t);
        } catch (DateTimeParseException e) {
            problems.add(new FieldIssue(pointer, "'" + t + "' is not a date (year-month-day, e.g. 2026-03-09)"));
            return null;
        }
    }

    static UUID uuid(String s, String pointer, List<FieldIssue> problems) {
        String t = text(s);
        if (t == null) {
            return null;
        }
        try {
            return UUID.fromString(t);
        } catch (IllegalArgumentException e) {
            problems.add(new FieldIssue(pointer, "not a known choice"));
            return null;
        }
    }

    static <E extends Enum<E>> E enumOf(Class<E> type, String s, String pointer, List<FieldIssue> problems) {
        String t = text(s);
        if (t == null) {
            return null;
        }
        try {
            return Enum.valueOf(type, t.toUpperCase(Locale.ROOT));
        } catch (IllegalArgumentException e) {
            problems.add(new FieldIssue(pointer, "'" + t + "' is not one of the choices"));
            return null;
        }
    }
}

package org.specimenledger.shared;

/**
 * One thing wrong with a request, and where: {@code pointer} is a JSON Pointer (RFC 6901) into the
 * request body, such as {@code /readings/0/valueMm}, or a parameter name.
 */
public record FieldIssue(String pointer, String detail) {
}

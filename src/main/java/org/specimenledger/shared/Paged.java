package org.specimenledger.shared;

import java.util.List;

/**
 * One page of a list in a stable order: the items, which page (from 0) of what size, and how many items the
 * whole list has. A page beyond the end has no items and the same total.
 */
public record Paged<T>(List<T> items, int page, int size, long total) {

    /** Largest page size a list endpoint accepts. */
    public static final int MAX_SIZE = 500;

    /** Refuses a page number below 0 or a size outside 1–{@link #MAX_SIZE}, naming the query parameter. */
    public static void check(int page, int size) {
        if (page < 0) {
            throw new RuleViolation("page", "page counts from 0, got " + page);
        }
        if (size < 1 || size > MAX_SIZE) {
            throw new RuleViolation("size", "size must be 1–" + MAX_SIZE + ", got " + size);
        }
    }
}

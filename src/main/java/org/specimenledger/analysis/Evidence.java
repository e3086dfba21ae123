package org.specimenledger.analysis;

import java.util.AbstractMap;
import java.util.Collections;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.Set;

/**
 * How a value was found, as an immutable ordered map of plain data: keys are stable camelCase names
 * (e.g. {@code firstIndex}, {@code slopeMPa}, {@code intersectionStrainPercent}), values are
 * {@link Integer}, {@link Long}, {@link Double}, {@link String}, {@link Boolean}, nested
 * {@code Evidence} or lists of those. Non-finite doubles are never stored (the key is left out), so
 * the map serialises to strict JSON as is. Point indices are 0-based into the arrays given to the
 * analysis. Units are in the key name (MPa, Percent, N, J, Mm, PerS).
 */
public final class Evidence extends AbstractMap<String, Object> {

    /** Evidence with no entries. */
    public static final Evidence EMPTY = new Evidence(new LinkedHashMap<>());

    private final Map<String, Object> entries;

    private Evidence(LinkedHashMap<String, Object> entries) {
        this.entries = Collections.unmodifiableMap(entries);
    }

    /**
     * Starts building evidence.
     *
     * @return an empty builder
     */
    public static Builder builder() {
        return new Builder();
    }

    @Override
    public Set<Entry<String, Object>> entrySet() {
        return entries.entrySet();
    }

    /** Collects entries in insertion order. */
    public static final class Builder {
        private final LinkedHashMap<String, Object> entries = new LinkedHashMap<>();

        private Builder() {
        }

        /**
         * Adds a number; NaN and infinities are left out.
         *
         * @param key the name
         * @param value the value
         * @return this builder
         */
        public Builder put(String key, double value) {
            if (Double.isFinite(value)) {
                entries.put(key, value);
            }
            return this;
        }

        /**
         * Adds an integer, typically a point index or a count.
         *
         * @param key the name
         * @param value the value
         * @return this builder
         */
        public Builder put(String key, int value) {
            entries.put(key, value);
            return this;
        }

        /**
         * Adds a string or flag or nested evidence or list; {@code null} is left out.
         *
         * @param key the name
         * @param value a String, Boolean, Evidence or List of plain values
         * @return this builder
         */
        public Builder put(String key, Object value) {
            if (value instanceof Double) {
                return put(key, ((Double) value).doubleValue());
            }
            if (value instanceof List) {
                entries.put(key, List.copyOf((List<?>) value));
            } else if (value != null) {
                entries.put(key, value);
            }
            return this;
        }

        /**
         * Adds all entries of other evidence.
         *
         * @param other evidence to copy
         * @return this builder
         */
        public Builder putAll(Evidence other) {
            entries.putAll(other);
            return this;
        }

        /**
         * Freezes the entries.
         *
         * @return the immutable evidence
         */
        public Evidence build() {
            return new Evidence(new LinkedHashMap<>(entries));
        }
    }
}

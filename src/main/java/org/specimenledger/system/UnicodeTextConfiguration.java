package org.specimenledger.system;

import org.springframework.context.annotation.Bean;
import org.springframework.context.annotation.Configuration;
import tools.jackson.core.JsonParser;
import tools.jackson.databind.DeserializationContext;
import tools.jackson.databind.JacksonModule;
import tools.jackson.databind.deser.jdk.StringDeserializer;
import tools.jackson.databind.exc.InvalidFormatException;
import tools.jackson.databind.module.SimpleModule;

/**
 * Refuses JSON strings that are not Unicode text. An escaped unpaired surrogate ({@code "\uD800"}) is valid JSON
 * syntax but names no character (RFC 8259 section 8.2 calls its behaviour unpredictable [S]); stored as it is, the
 * database driver's UTF-8 encoder would silently put a '?' in its place, so what was typed and what is kept, printed
 * and signed would differ. Such a string is a 400 problem naming the field and the character position, and nothing
 * is stored. The module is registered with the application's JSON mapper (a {@link JacksonModule} bean).
 */
@Configuration(proxyBeanMethods = false)
class UnicodeTextConfiguration {

    @Bean
    JacksonModule unicodeTextModule() {
        SimpleModule module = new SimpleModule("unicode-text");
        module.addDeserializer(String.class, new UnicodeStrings());
        return module;
    }

    /** The standard string reading, then the check. */
    static final class UnicodeStrings extends StringDeserializer {

        @Override
        public String deserialize(JsonParser p, DeserializationContext ctxt) {
            String text = super.deserialize(p, ctxt);
            int at = unpairedSurrogateAt(text);
            if (at >= 0) {
                // the value itself is not quoted back: it cannot be written as UTF-8 either
                throw InvalidFormatException.from(p, "text with an unpaired surrogate", String.format(
                        "(text with an unpaired surrogate U+%04X at character %d)", (int) text.charAt(at), at + 1),
                        String.class);
            }
            return text;
        }
    }

    /** The index of the first surrogate that is not half of a pair, or -1. */
    static int unpairedSurrogateAt(String text) {
        if (text == null) {
            return -1;
        }
        for (int i = 0; i < text.length(); i++) {
            char c = text.charAt(i);
            if (Character.isHighSurrogate(c) && i + 1 < text.length() && Character.isLowSurrogate(text.charAt(i + 1))) {
                i++;
            } else if (Character.isSurrogate(c)) {
                return i;
            }
        }
        return -1;
    }
}

package org.spectralsieve.api;

import org.springframework.boot.jackson.autoconfigure.JsonMapperBuilderCustomizer;
import org.springframework.context.annotation.Bean;
import org.springframework.context.annotation.Configuration;
import tools.jackson.core.StreamWriteFeature;

/**
 * Answers write their doubles with the JSON library's shortest-decimal writer (Schubfach) instead of
 * {@code Double.toString}: a curve read writes about three thousand numbers, and under load the digits were a
 * twentieth of the request threads' CPU (docs/judgement-memo.md, "Profile"). Every number still parses back to
 * exactly the double written ({@code JsonNumbersTest}); on Java 17 the text differs from {@code Double.toString}
 * only where that gives more digits than needed. {@code -Dsieve.json.fast-doubles=false} writes them the earlier
 * way, only so a benchmark can compare both.
 */
@Configuration(proxyBeanMethods = false)
public class JsonNumbersConfiguration {

    /** Whether the shortest-decimal writer is used: on unless {@code -Dsieve.json.fast-doubles=false}. */
    static boolean fastDoubles() {
        return !"false".equals(System.getProperty("sieve.json.fast-doubles"));
    }

    @Bean
    JsonMapperBuilderCustomizer shortestDoubles() {
        return builder -> {
            if (fastDoubles()) {
                builder.enable(StreamWriteFeature.USE_FAST_DOUBLE_WRITER);
            }
        };
    }
}

package org.spectralsieve.seed;

import org.springframework.boot.context.properties.ConfigurationProperties;
import org.springframework.boot.context.properties.bind.DefaultValue;

/**
 * @param loadOnEmpty load the illustrative demo library when the database holds no material yet
 * @param location    where the catalogue lives (classpath or file URL of the seed-materials folder)
 */
@ConfigurationProperties("sieve.seed")
public record SeedProperties(@DefaultValue("true") boolean loadOnEmpty,
                             @DefaultValue("classpath:seed-materials/") String location) {
}

package org.spectralsieve.ingest;

import org.springframework.boot.context.properties.ConfigurationProperties;
import org.springframework.boot.context.properties.bind.DefaultValue;

/**
 * Upload limits. The HTTP multipart limits are set from {@code maxFileBytes} in application.properties,
 * so one setting caps both an upload and a file inside a zip or folder.
 *
 * @param maxFileBytes  largest file (and HTTP upload) in bytes; 20 MB holds a 1 pm-step spectrum many times over
 * @param maxPoints     most points in one curve (a 0.01 nm grid from 190 to 2190 nm)
 * @param maxZipEntries most entries in a batch zip (a guard against archives made to exhaust the server)
 * @param maxZipBytes   most bytes a batch zip may unpack to in total
 */
@ConfigurationProperties("sieve.imports")
public record ImportProperties(@DefaultValue("20971520") long maxFileBytes,
                               @DefaultValue("200000") int maxPoints,
                               @DefaultValue("1000") int maxZipEntries,
                               @DefaultValue("209715200") long maxZipBytes) {

    public ImportProperties {
        if (maxFileBytes < 1 || maxPoints < 2 || maxZipEntries < 1 || maxZipBytes < 1) {
            throw new IllegalArgumentException("sieve.imports limits must be positive (max-points at least 2)");
        }
    }

    public static ImportProperties defaults() {
        return new ImportProperties(20_971_520L, 200_000, 1000, 209_715_200L);
    }
}

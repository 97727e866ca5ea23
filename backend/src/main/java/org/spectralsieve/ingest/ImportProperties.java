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
 * @param maxZipBytes   most bytes a batch zip may unpack to in total (also bounds the inflating work of one request)
 * @param maxZipRatio   largest ratio of a zip entry's inflated to compressed size; spectrum files compress
 *                      3 to 30 times, a zip bomb about 1000 times, so 100 refuses the one and never the other
 * @param maxConcurrentImports imports (single files and batches) worked on at once; each holds at most its
 *                      upload and one inflated file of {@code maxFileBytes}, so this bounds their memory
 * @param maxQueuedImports imports that may wait for a turn; one more is answered 429 with Retry-After. A waiting
 *                      import has read none of its upload (the turn is taken before the body is read), so it
 *                      costs no heap for it, only a request thread: 48 keeps at most a quarter of the
 *                      container's 200 request threads waiting (docs/limits.md, "Imports")
 * @param queueWaitSeconds longest a waiting import waits before it is answered 429
 */
@ConfigurationProperties("sieve.imports")
public record ImportProperties(@DefaultValue("20971520") long maxFileBytes,
                               @DefaultValue("200000") int maxPoints,
                               @DefaultValue("1000") int maxZipEntries,
                               @DefaultValue("209715200") long maxZipBytes,
                               @DefaultValue("100") int maxZipRatio,
                               @DefaultValue("2") int maxConcurrentImports,
                               @DefaultValue("48") int maxQueuedImports,
                               @DefaultValue("30") int queueWaitSeconds) {

    public ImportProperties {
        if (maxFileBytes < 1 || maxPoints < 2 || maxZipEntries < 1 || maxZipBytes < 1 || maxZipRatio < 1
                || maxConcurrentImports < 1 || maxQueuedImports < 0 || queueWaitSeconds < 0) {
            throw new IllegalArgumentException("sieve.imports limits must be positive (max-points at least 2;"
                    + " max-queued-imports and queue-wait-seconds may be 0)");
        }
    }

    public static ImportProperties defaults() {
        return new ImportProperties(20_971_520L, 200_000, 1000, 209_715_200L, 100, 2, 48, 30);
    }
}

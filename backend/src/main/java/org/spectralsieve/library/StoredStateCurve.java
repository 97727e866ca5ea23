package org.spectralsieve.library;

import java.time.Instant;
import org.spectralsieve.states.StateCurve;

/**
 * A stored state curve as the API, the page and the command line show it: the curve in its state
 * ({@link StateCurve}) with where it came from and whether it is in use.
 *
 * @param sourceFileName the file it was read from ('' when none was named)
 * @param hasSourceFile  whether the file's bytes are kept (a modelled demo curve has none)
 * @param retiredAt      null while in use
 */
public record StoredStateCurve(StateCurve stateCurve, long sampleId, double detectionLimit, String notes,
                               String sourceFileName, String sourceSha256, boolean hasSourceFile, Instant createdAt,
                               Instant retiredAt) {

    public long id() {
        return stateCurve.id();
    }

    public boolean retired() {
        return retiredAt != null;
    }
}

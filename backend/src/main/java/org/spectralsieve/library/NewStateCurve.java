package org.spectralsieve.library;

import java.util.Objects;
import org.spectralsieve.spectrum.Curve;
import org.spectralsieve.states.MaterialState;
import org.spectralsieve.states.StateKind;

/**
 * A sample's curve in another state, about to be stored ({@link JooqLibraryRepository#storeStateCurve}).
 *
 * @param thicknessMm    what it was measured at; NaN when not recorded
 * @param detectionLimit the limit every point shares unless the curve carries its own per point
 * @param file           the file it was read from, kept with it; null for a curve stored without one (a modelled
 *                       demo curve), which then names its origin in {@code sourceFileName} and {@code sourceSha256}
 */
public record NewStateCurve(MaterialState state, Curve curve, double thicknessMm, double detectionLimit, String notes,
                            SourceFile file, String sourceFileName, String sourceSha256) {

    public static final int MAX_NOTES = NewSample.MAX_NOTES;

    public NewStateCurve {
        Objects.requireNonNull(state, "state");
        Objects.requireNonNull(curve, "curve");
        if (state.kind() == StateKind.AS_SUPPLIED) {
            throw new FieldException("state", "the sample's own curve is its as-supplied state; a state curve is aged"
                    + " or printed");
        }
        if (!Double.isNaN(thicknessMm) && !(thicknessMm > 0 && Double.isFinite(thicknessMm))) {
            throw new FieldException("thicknessMm", "must be above 0 mm, got " + thicknessMm);
        }
        if (!(detectionLimit >= 0 && detectionLimit < 1)) {
            throw new FieldException("detectionLimit", "must lie in [0, 1), got " + detectionLimit);
        }
        notes = Objects.requireNonNullElse(notes, "");
        if (notes.length() > MAX_NOTES) {
            throw new FieldException("notes", "at most " + MAX_NOTES + " characters, got " + notes.length());
        }
        if (file != null) {
            sourceFileName = file.fileName();
            sourceSha256 = file.sha256();
        }
        sourceFileName = Objects.requireNonNullElse(sourceFileName, "");
        if (sourceSha256 == null || !sourceSha256.matches("[0-9a-f]{64}")) {
            throw new IllegalArgumentException("sourceSha256 must be 64 lower-case hex digits, was '" + sourceSha256 + "'");
        }
    }

    /** A state curve read from an imported file, kept with it. */
    public static NewStateCurve fromFile(MaterialState state, Curve curve, double thicknessMm, double detectionLimit,
                                         String notes, SourceFile file) {
        return new NewStateCurve(state, curve, thicknessMm, detectionLimit, notes, Objects.requireNonNull(file, "file"),
                null, null);
    }
}

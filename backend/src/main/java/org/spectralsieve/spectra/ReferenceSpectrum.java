package org.spectralsieve.spectra;

import java.time.OffsetDateTime;
import java.util.Arrays;
import java.util.Objects;

/**
 * One stored imported spectrum, without its file's bytes (see
 * {@link ReferenceSpectrumRepository#findSourceFile}). Arrays are copied in and out.
 *
 * @param wavelengthsNm strictly increasing, as imported (an emitter is cut to 100–1100 nm only when used)
 * @param values        relative power (emitter) or weight (response), as written in the file
 * @param valueColumn   the file's column or JCAMP-DX data label the values came from
 * @param sourceFormat  the import format label: delimited or jcamp-dx
 */
public record ReferenceSpectrum(long id, SpectrumKind kind, String name, String description, String provenanceNote,
                                String valueColumn, double[] wavelengthsNm, double[] values, String sourceFileName,
                                String sourceFormat, String sourceSha256, OffsetDateTime createdAt) {

    public ReferenceSpectrum {
        Objects.requireNonNull(kind, "kind");
        Objects.requireNonNull(name, "name");
        wavelengthsNm = wavelengthsNm.clone();
        values = values.clone();
        if (wavelengthsNm.length != values.length) {
            throw new IllegalArgumentException(wavelengthsNm.length + " wavelengths but " + values.length + " values");
        }
    }

    @Override
    public double[] wavelengthsNm() {
        return wavelengthsNm.clone();
    }

    @Override
    public double[] values() {
        return values.clone();
    }

    public int pointCount() {
        return values.length;
    }

    public double minNm() {
        return wavelengthsNm[0];
    }

    public double maxNm() {
        return wavelengthsNm[wavelengthsNm.length - 1];
    }

    @Override
    public boolean equals(Object o) {
        return o instanceof ReferenceSpectrum r && id == r.id && kind == r.kind && name.equals(r.name)
                && description.equals(r.description) && provenanceNote.equals(r.provenanceNote)
                && valueColumn.equals(r.valueColumn) && Arrays.equals(wavelengthsNm, r.wavelengthsNm)
                && Arrays.equals(values, r.values) && sourceFileName.equals(r.sourceFileName)
                && sourceFormat.equals(r.sourceFormat) && sourceSha256.equals(r.sourceSha256)
                && Objects.equals(createdAt, r.createdAt);
    }

    @Override
    public int hashCode() {
        return Objects.hash(id, kind, name, sourceSha256);
    }

    @Override
    public String toString() {
        return "ReferenceSpectrum[" + kind.label() + " '" + name + "', " + pointCount() + " points, " + minNm() + "–"
                + maxNm() + " nm, from " + sourceFileName + "]";
    }
}

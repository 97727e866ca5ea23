package org.spectralsieve.api;

import org.spectralsieve.ingest.ImportOptions;
import org.spectralsieve.ingest.ImportRequestException;
import org.spectralsieve.ingest.ImportTarget;
import org.spectralsieve.ingest.OptionText;
import org.spectralsieve.ingest.SampleFields;
import org.spectralsieve.library.NewMaterial;
import org.spectralsieve.library.NewSample;
import org.spectralsieve.optics.ConstantIndex;

/**
 * The multipart form fields of the import endpoints, bound by name. All are text so that a bad value
 * is refused by {@link OptionText} with a message naming the field, never by a type conversion.
 */
final class ImportForms {

    private ImportForms() {
    }

    /**
     * How to read the file; every field optional.
     *
     * @param format          delimited, jcamp-dx, raw-counts, datasheet-points (default: detected)
     * @param yKind           percent, fraction, absorbance (default: detected)
     * @param decimalMark     point or comma (default: detected)
     * @param replicates      first (default), mean, separate
     * @param mergeDuplicates true to average rows repeating a wavelength (default false: refused)
     * @param detectionLimit  fraction in [0, 1); default the file's detection_limit, else 0
     * @param strayLightFloor raw counts: fraction in [0, 1), default 0
     * @param fullScale       raw counts: detector maximum count, default unknown
     * @param block           JCAMP-DX: the block to read, numbered as the preview's block list (default: the first)
     * @param eachBlock       JCAMP-DX: true to store every block as its own sample (default false)
     * @param uncertainty     the instrument's stated uncertainty (one standard deviation), "0.5%T" or "0.01A",
     *                        combined with a file's own standard deviations (root sum of squares)
     */
    record ReadForm(String format, String yKind, String decimalMark, String replicates, String mergeDuplicates,
                    String detectionLimit, String strayLightFloor, String fullScale, String block, String eachBlock,
                    String uncertainty) {
        ImportOptions options() {
            ImportOptions o = OptionText.options(format, yKind, decimalMark, replicates, mergeDuplicates, detectionLimit,
                    strayLightFloor, fullScale)
                    .withStatedUncertainty(OptionText.statedUncertainty("uncertainty", uncertainty));
            return OptionText.withBlocks(o, "block", block, "eachBlock", eachBlock);
        }
    }

    /**
     * The part of the file's wavelength axis to keep, in nm; blank = the whole axis without a noise region
     * at either end (see {@code ingest.KeptRange}).
     *
     * @param from shortest wavelength kept
     * @param to   longest wavelength kept
     */
    record KeepForm(String from, String to) {
        ImportOptions applyTo(ImportOptions options) {
            return OptionText.keepRange(options, "from", from, "to", to);
        }
    }

    /**
     * Corrections of what the file says about its axes; every field optional.
     *
     * @param xUnit   nm, um, angstrom, cm-1: the wavelength unit whatever the header or XUNITS say
     * @param xColumn the wavelength column, counted from 1 (delimited text)
     * @param yColumn the value column, counted from 1 (delimited text)
     */
    record AxisForm(String xUnit, String xColumn, String yColumn) {
        ImportOptions applyTo(ImportOptions options) {
            return OptionText.withAxes(options, "xUnit", xUnit, "xColumn", xColumn, "yColumn", yColumn);
        }
    }

    /**
     * Where to store and what the sample is: either {@code materialId}, or {@code materialName} with
     * {@code materialClass}, {@code scaling} (bulk|fixed) and optionally {@code indexN} and
     * {@code description}, {@code stockThicknesses} ("2 3 6", "25 50 125 um") and {@code madeRange}
     * ("1 to 12", "25-125 um") for a new material.
     */
    record StoreForm(String materialId, String materialName, String materialClass, String scaling, String indexN,
                     String description, String thicknessMm, String geometry, String provenance, String instrument,
                     String measuredOn, String lot, String notes, String stockThicknesses, String madeRange) {

        ImportTarget target() {
            boolean existing = materialId != null && !materialId.isBlank();
            boolean fresh = materialName != null && !materialName.isBlank();
            if (existing == fresh) {
                throw new ImportRequestException(existing ? "materialName" : "materialId",
                        "give either materialId (an existing material) or materialName with materialClass and scaling"
                                + " (a new one), not " + (existing ? "both" : "neither"));
            }
            if (existing) {
                try {
                    return new ImportTarget.ExistingMaterial(Long.parseLong(materialId.strip()));
                } catch (NumberFormatException e) {
                    throw new ImportRequestException("materialId", "'" + materialId + "' is not a whole number");
                }
            }
            ConstantIndex index = null;
            var n = OptionText.number("indexN", indexN);
            if (n.isPresent()) {
                try {
                    index = new ConstantIndex(n.getAsDouble());
                } catch (IllegalArgumentException e) {
                    throw new ImportRequestException("indexN", e.getMessage());
                }
            }
            return new ImportTarget.NewMaterial(OptionText.line("materialName", materialName, NewMaterial.MAX_NAME),
                    OptionText.materialClass("materialClass", materialClass), OptionText.scaling("scaling", scaling), index,
                    OptionText.paragraph("description", description, NewMaterial.MAX_DESCRIPTION),
                    OptionText.thicknesses("stockThicknesses", stockThicknesses, "madeRange", madeRange));
        }

        SampleFields fields() {
            return new SampleFields(OptionText.thicknessOrNull("thicknessMm", thicknessMm),
                    OptionText.geometry("geometry", geometry), OptionText.provenance("provenance", provenance),
                    OptionText.line("instrument", instrument, NewSample.MAX_INSTRUMENT),
                    OptionText.date("measuredOn", measuredOn), OptionText.line("lot", lot, NewSample.MAX_LOT),
                    OptionText.paragraph("notes", notes, NewSample.MAX_NOTES));
        }
    }
}

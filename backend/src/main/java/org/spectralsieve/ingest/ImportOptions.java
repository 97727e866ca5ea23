package org.spectralsieve.ingest;

import java.util.Optional;
import java.util.OptionalDouble;
import java.util.OptionalInt;
import org.spectralsieve.importers.DecimalMark;
import org.spectralsieve.importers.Replicates;
import org.spectralsieve.importers.XUnit;
import org.spectralsieve.importers.YKind;

/**
 * How to read one file. Everything is detected when left empty; an explicit value wins over detection.
 *
 * @param format          forces the format instead of extension and content sniffing
 * @param yKind           forces the meaning of the value column (percent, fraction, absorbance)
 * @param decimalMark     forces the decimal mark (a file like {@code 1,5 2,5} cannot tell by itself)
 * @param replicates      several value columns: first, mean or separate (separate stores the first)
 * @param mergeDuplicates average rows that repeat a wavelength instead of refusing the file
 * @param detectionLimit  transmittance fraction in [0, 1) at or below which a value is only an upper
 *                        bound; empty = the file's {@code detection_limit} metadata, else 0
 * @param strayLightFloor raw counts: the instrument's stray-light floor as a fraction in [0, 1)
 * @param fullScale       raw counts: the detector's maximum count (saturation); empty = unknown
 * @param keepFromNm      the shortest wavelength to keep (nm); points below it are left out, with a warning
 * @param keepToNm        the longest wavelength to keep (nm); points above it are left out, with a warning
 * @param block           JCAMP-DX: the block to import, as numbered in the preview's block list
 * @param eachBlock       JCAMP-DX: import every block as its own sample
 * @param xUnit           forces the unit of the wavelength axis (a file may state the wrong one)
 * @param xColumn         forces the wavelength column, counted from 1 as the file's columns are
 * @param yColumn         forces the value column, counted from 1 as the file's columns are
 * @param statedUncertainty the instrument's uncertainty for every point, when the file gives none
 */
public record ImportOptions(Optional<ImportFormat> format, Optional<YKind> yKind, Optional<DecimalMark> decimalMark,
                            Replicates replicates, boolean mergeDuplicates, OptionalDouble detectionLimit,
                            OptionalDouble strayLightFloor, OptionalDouble fullScale,
                            OptionalDouble keepFromNm, OptionalDouble keepToNm, OptionalInt block, boolean eachBlock,
                            Optional<XUnit> xUnit, OptionalInt xColumn, OptionalInt yColumn,
                            Optional<StatedUncertainty> statedUncertainty) {

    /** The options every caller knew before keep ranges, blocks, axis overrides and uncertainty existed. */
    public ImportOptions(Optional<ImportFormat> format, Optional<YKind> yKind, Optional<DecimalMark> decimalMark,
                         Replicates replicates, boolean mergeDuplicates, OptionalDouble detectionLimit,
                         OptionalDouble strayLightFloor, OptionalDouble fullScale) {
        this(format, yKind, decimalMark, replicates, mergeDuplicates, detectionLimit, strayLightFloor, fullScale,
                OptionalDouble.empty(), OptionalDouble.empty(), OptionalInt.empty(), false, Optional.empty(),
                OptionalInt.empty(), OptionalInt.empty(), Optional.empty());
    }

    public ImportOptions {
        format = format == null ? Optional.empty() : format;
        yKind = yKind == null ? Optional.empty() : yKind;
        decimalMark = decimalMark == null ? Optional.empty() : decimalMark;
        replicates = replicates == null ? Replicates.FIRST : replicates;
        detectionLimit = detectionLimit == null ? OptionalDouble.empty() : detectionLimit;
        strayLightFloor = strayLightFloor == null ? OptionalDouble.empty() : strayLightFloor;
        fullScale = fullScale == null ? OptionalDouble.empty() : fullScale;
        keepFromNm = keepFromNm == null ? OptionalDouble.empty() : keepFromNm;
        keepToNm = keepToNm == null ? OptionalDouble.empty() : keepToNm;
        block = block == null ? OptionalInt.empty() : block;
        xUnit = xUnit == null ? Optional.empty() : xUnit;
        xColumn = xColumn == null ? OptionalInt.empty() : xColumn;
        yColumn = yColumn == null ? OptionalInt.empty() : yColumn;
        statedUncertainty = statedUncertainty == null ? Optional.empty() : statedUncertainty;
        keepFromNm.ifPresent(v -> requireWavelength("from", v));
        keepToNm.ifPresent(v -> requireWavelength("to", v));
        if (keepFromNm.isPresent() && keepToNm.isPresent() && !(keepFromNm.getAsDouble() < keepToNm.getAsDouble())) {
            throw new IllegalArgumentException("from must be shorter than to, got from " + keepFromNm.getAsDouble()
                    + " nm and to " + keepToNm.getAsDouble() + " nm");
        }
        block.ifPresent(b -> {
            if (b < 0) {
                throw new IllegalArgumentException("block must be a block number from the preview (0 or more), got " + b);
            }
        });
        if (eachBlock && block.isPresent()) {
            throw new IllegalArgumentException("block and eachBlock exclude each other: choose one block or all of them");
        }
        xColumn.ifPresent(c -> requireColumn("xColumn", c));
        yColumn.ifPresent(c -> requireColumn("yColumn", c));
        if (xColumn.isPresent() && yColumn.isPresent() && xColumn.getAsInt() == yColumn.getAsInt()) {
            throw new IllegalArgumentException("xColumn and yColumn must differ, both are " + xColumn.getAsInt());
        }
        detectionLimit.ifPresent(v -> requireFraction("detectionLimit", v));
        strayLightFloor.ifPresent(v -> requireFraction("strayLightFloor", v));
        fullScale.ifPresent(v -> {
            if (!(v > 0) || !Double.isFinite(v)) {
                throw new IllegalArgumentException("fullScale must be a positive number of counts, got " + v);
            }
        });
    }

    private static void requireWavelength(String name, double nm) {
        if (!(nm > 0 && nm <= 1_000_000)) {
            throw new IllegalArgumentException(name + " must be a wavelength in nm greater than 0, got " + nm);
        }
    }

    private static void requireColumn(String name, int column) {
        if (column < 1 || column > 1024) {
            throw new IllegalArgumentException(name + " must be a column number from 1 to 1024, got " + column);
        }
    }

    private static void requireFraction(String name, double v) {
        if (!(v >= 0 && v < 1)) {
            throw new IllegalArgumentException(name + " must be a transmittance fraction in [0, 1), got " + v);
        }
    }

    /** Detect everything. */
    public static ImportOptions defaults() {
        return new ImportOptions(Optional.empty(), Optional.empty(), Optional.empty(), Replicates.FIRST, false,
                OptionalDouble.empty(), OptionalDouble.empty(), OptionalDouble.empty());
    }

    public ImportOptions withFormat(ImportFormat f) {
        return new ImportOptions(Optional.of(f), yKind, decimalMark, replicates, mergeDuplicates, detectionLimit,
                strayLightFloor, fullScale, keepFromNm, keepToNm, block, eachBlock, xUnit, xColumn, yColumn,
                statedUncertainty);
    }

    public ImportOptions withDetectionLimit(double limit) {
        return new ImportOptions(format, yKind, decimalMark, replicates, mergeDuplicates, OptionalDouble.of(limit),
                strayLightFloor, fullScale, keepFromNm, keepToNm, block, eachBlock, xUnit, xColumn, yColumn,
                statedUncertainty);
    }

    /** Keeps only {@code fromNm..toNm}; either end may be empty (open). */
    public ImportOptions withKeepRange(OptionalDouble fromNm, OptionalDouble toNm) {
        return new ImportOptions(format, yKind, decimalMark, replicates, mergeDuplicates, detectionLimit,
                strayLightFloor, fullScale, fromNm, toNm, block, eachBlock, xUnit, xColumn, yColumn,
                statedUncertainty);
    }

    /** One chosen block ({@code block} present) or every block ({@code each}); neither = the first. */
    public ImportOptions withBlocks(OptionalInt chosen, boolean each) {
        return new ImportOptions(format, yKind, decimalMark, replicates, mergeDuplicates, detectionLimit,
                strayLightFloor, fullScale, keepFromNm, keepToNm, chosen, each, xUnit, xColumn, yColumn,
                statedUncertainty);
    }

    /** Overrides of what the file says about its axes; empty parts are detected as before. */
    public ImportOptions withAxes(Optional<XUnit> unit, OptionalInt x, OptionalInt y) {
        return new ImportOptions(format, yKind, decimalMark, replicates, mergeDuplicates, detectionLimit,
                strayLightFloor, fullScale, keepFromNm, keepToNm, block, eachBlock, unit, x, y, statedUncertainty);
    }

    public ImportOptions withStatedUncertainty(Optional<StatedUncertainty> stated) {
        return new ImportOptions(format, yKind, decimalMark, replicates, mergeDuplicates, detectionLimit,
                strayLightFloor, fullScale, keepFromNm, keepToNm, block, eachBlock, xUnit, xColumn, yColumn, stated);
    }
}

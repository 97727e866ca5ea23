package org.spectralsieve.ingest;

import org.spectralsieve.optics.PhysicalRanges;

import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.OptionalDouble;
import java.util.Set;
import org.spectralsieve.library.MaterialCorrection;
import org.spectralsieve.library.SampleCorrection;
import org.spectralsieve.library.StatedThicknesses;
import org.spectralsieve.optics.ConstantIndex;
import org.spectralsieve.optics.RefractiveIndex;

/**
 * A correction as the user wrote it, field by field in text (HTTP JSON and the command line give the same
 * names), read with the very parsers and limits an import uses ({@link OptionText}, {@link ImportService}'s
 * lengths), so a value an import refuses is refused here with the same problem naming the same field.
 * Fields left out (or blank) stay as they are.
 */
public final class SampleCorrectionForm {

    /** The fields of a sample a correction may change; the curve is not one of them (it is the measurement). */
    public static final List<String> SAMPLE_FIELDS = List.of("thicknessMm", "geometry", "instrument", "measuredOn", "lot",
            "notes", "detectionLimit");

    /** The fields of a material a correction may change (its index, the thicknesses it is made in). */
    public static final List<String> MATERIAL_FIELDS = List.of("indexN", "stockThicknesses", "madeRange");

    /** Longest reason kept with a revision (the column's width). */
    public static final int MAX_REASON = 1000;

    private static final Set<String> MEASUREMENT = Set.of("curve", "wavelengthsNm", "transmittance", "belowDetection",
            "points", "file", "sourceFile", "sha256");

    private SampleCorrectionForm() {
    }

    /** @throws ImportRequestException naming the first field that is unknown, malformed or out of range */
    public static SampleCorrection sample(Map<String, String> fields) {
        checkNames(fields, SAMPLE_FIELDS);
        Double thickness = OptionText.positiveOrNull("thicknessMm", fields.get("thicknessMm"));
        if (thickness != null && !PhysicalRanges.isThicknessMm(thickness)) {
            // the range every stored thickness keeps (docs/validation.md), as an import's
            throw new ImportRequestException("thicknessMm", "must be from " + PhysicalRanges.MIN_THICKNESS_MM + " to "
                    + PhysicalRanges.MAX_THICKNESS_MM + " mm, got " + thickness);
        }
        OptionalDouble limit = OptionText.number("detectionLimit", fields.get("detectionLimit"));
        if (limit.isPresent() && !(limit.getAsDouble() >= 0 && limit.getAsDouble() < 1)) {
            // the words of ImportOptions, which checks the detection limit an import is given
            throw new ImportRequestException("detectionLimit", "detectionLimit must be a transmittance fraction in [0, 1), got "
                    + limit.getAsDouble());
        }
        SampleCorrection c = new SampleCorrection(thickness, OptionText.geometry("geometry", fields.get("geometry")),
                text(fields, "instrument", ImportService.MAX_INSTRUMENT), OptionText.date("measuredOn", fields.get("measuredOn")),
                text(fields, "lot", ImportService.MAX_LOT), text(fields, "notes", ImportService.MAX_NOTES),
                limit.isPresent() ? limit.getAsDouble() : null, reason(fields));
        if (SAMPLE_FIELDS.stream().allMatch(f -> OptionText.blank(fields.get(f)))) {
            throw new ImportRequestException("thicknessMm", "a correction changes at least one of " + SAMPLE_FIELDS);
        }
        return c;
    }

    /** @throws ImportRequestException naming the first field that is unknown, malformed or out of range */
    public static MaterialCorrection material(Map<String, String> fields) {
        checkNames(fields, MATERIAL_FIELDS);
        RefractiveIndex index = null;
        OptionalDouble n = OptionText.number("indexN", fields.get("indexN"));
        if (n.isPresent()) {
            try {
                index = new ConstantIndex(n.getAsDouble()); // as the import form builds it
            } catch (IllegalArgumentException e) {
                throw new ImportRequestException("indexN", e.getMessage());
            }
        }
        String stock = fields.get("stockThicknesses");
        String range = fields.get("madeRange");
        StatedThicknesses thicknesses = stock == null && range == null ? null
                : OptionText.thicknesses("stockThicknesses", stock, "madeRange", range);
        if (index == null && thicknesses == null) {
            throw new ImportRequestException("indexN", "a correction changes at least one of " + MATERIAL_FIELDS);
        }
        return new MaterialCorrection(index, thicknesses, reason(fields));
    }

    /** Text values from JSON: strings as they are, numbers in their shortest form; null values left out. */
    public static Map<String, String> ofValues(Map<String, Object> values) {
        Map<String, String> out = new LinkedHashMap<>();
        values.forEach((k, v) -> {
            if (v != null) {
                out.put(k, v.toString());
            }
        });
        return out;
    }

    private static void checkNames(Map<String, String> fields, List<String> allowed) {
        for (String name : fields.keySet()) {
            if (MEASUREMENT.contains(name)) {
                throw new ImportRequestException(name, "the curve is the measurement and never changes; a correction"
                        + " changes how it is read (" + allowed + "); import the right file as a new sample instead");
            }
            if (!name.equals("reason") && !allowed.contains(name)) {
                throw new ImportRequestException(name, "cannot be corrected; a correction may change " + allowed
                        + " and says why in 'reason'");
            }
        }
    }

    private static String reason(Map<String, String> fields) {
        String reason = fields.get("reason");
        if (OptionText.blank(reason)) {
            throw new ImportRequestException("reason", "say why the values change; it is kept with the revision");
        }
        return text(fields, "reason", MAX_REASON);
    }

    /** Blank means unchanged; otherwise stripped, within the import's length and without control characters. */
    private static String text(Map<String, String> fields, String field, int max) {
        String value = fields.get(field);
        if (OptionText.blank(value)) {
            return null;
        }
        String v = value.strip();
        if (v.length() > max) {
            throw new ImportRequestException(field, "at most " + max + " characters, got " + v.length());
        }
        for (int i = 0; i < v.length(); i++) {
            char ch = v.charAt(i);
            boolean allowedBreak = field.equals("notes") || field.equals("reason") ? ch == '\n' || ch == '\t' : false;
            if ((Character.isISOControl(ch) && !allowedBreak) || Character.getType(ch) == Character.FORMAT) {
                throw new ImportRequestException(field, "holds the control character U+"
                        + String.format("%04X", (int) ch) + " at position " + (i + 1));
            }
        }
        return v;
    }
}

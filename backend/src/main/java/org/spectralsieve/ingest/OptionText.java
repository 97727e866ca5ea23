package org.spectralsieve.ingest;

import java.time.LocalDate;
import java.util.ArrayList;
import java.util.List;
import java.time.format.DateTimeParseException;
import java.util.Locale;
import java.util.Optional;
import java.util.OptionalDouble;
import java.util.OptionalInt;
import org.spectralsieve.importers.DecimalMark;
import org.spectralsieve.importers.Replicates;
import org.spectralsieve.importers.XUnit;
import org.spectralsieve.importers.YKind;
import org.spectralsieve.library.Geometry;
import org.spectralsieve.library.MaterialClass;
import org.spectralsieve.library.Provenance;
import org.spectralsieve.library.Scaling;
import org.spectralsieve.library.StatedThicknesses;
import org.spectralsieve.library.StoredText;
import org.spectralsieve.library.FieldException;
import org.spectralsieve.optics.PhysicalRanges;

/**
 * Import options and sample fields as users write them (HTTP form fields, manifest cells), parsed in one
 * place so both refuse the same mistakes with the same words. Blank means "not given"; every refusal is
 * an {@link ImportRequestException} naming the field.
 */
public final class OptionText {

    private OptionText() {
    }

    static boolean blank(String s) {
        return s == null || s.isBlank();
    }

    /**
     * The thicknesses a new material exists in, as written: stock sizes "2 3 6" or "25, 50, 125 um" (commas,
     * semicolons or spaces between them) and a made range "1 to 12", "1-12 mm" or "25–125 µm"; mm unless
     * the text ends in um or µm. Both blank: nothing stated (the assumed rule applies, see docs/thickness.md).
     */
    public static StatedThicknesses thicknesses(String stockField, String stock, String rangeField, String range) {
        List<Double> stockMm = new ArrayList<>();
        if (!blank(stock)) {
            Measured m = unit(stock);
            for (String part : m.text().split("[,;\\s]+")) {
                if (!part.isBlank()) {
                    stockMm.add(inRange(stockField, positive(stockField, part) / m.perMm()));
                }
            }
        }
        double lo = Double.NaN;
        double hi = Double.NaN;
        if (!blank(range)) {
            Measured m = unit(range);
            String[] ends = m.text().strip().split("\\s*(?:\\bto\\b|–|(?<=\\d)\\s*-\\s*(?=\\d))\\s*");
            if (ends.length != 2) {
                throw new ImportRequestException(rangeField, "'" + range + "' is not a range like '1 to 12' or '25-125 um'");
            }
            lo = positive(rangeField, ends[0]) / m.perMm();
            hi = positive(rangeField, ends[1]) / m.perMm();
            for (double end : new double[] {lo, hi}) {
                inRange(rangeField, end);
            }
        }
        try {
            return new StatedThicknesses(stockMm, lo, hi);
        } catch (IllegalArgumentException e) {
            throw new ImportRequestException(blank(range) ? stockField : rangeField, e.getMessage());
        }
    }

    private static double inRange(String field, double mm) {
        if (!PhysicalRanges.isThicknessMm(mm)) {
            throw new ImportRequestException(field, "a thickness must be from " + PhysicalRanges.MIN_THICKNESS_MM
                    + " mm (1 µm) to " + (long) PhysicalRanges.MAX_THICKNESS_MM + " mm, got " + mm + " mm");
        }
        return mm;
    }

    /** The text without its unit, and how many of that unit make a millimetre. */
    private record Measured(String text, double perMm) {
    }

    private static Measured unit(String s) {
        String t = s.strip();
        String lower = t.toLowerCase(Locale.ROOT);
        for (String um : List.of("um", "µm", "μm")) {
            if (lower.endsWith(um)) {
                return new Measured(t.substring(0, t.length() - um.length()), 1000);
            }
        }
        return new Measured(lower.endsWith("mm") ? t.substring(0, t.length() - 2) : t, 1);
    }

    private static double positive(String field, String number) {
        double v;
        try {
            v = Double.parseDouble(number.strip());
        } catch (NumberFormatException e) {
            throw new ImportRequestException(field, "'" + number.strip() + "' is not a thickness");
        }
        if (!(v > 0) || !Double.isFinite(v)) {
            throw new ImportRequestException(field, "a thickness must be a number > 0, got " + number.strip());
        }
        return v;
    }

    /**
     * A sample thickness in mm, or null when not given: a number within {@link PhysicalRanges} (1 µm to 1 m),
     * so that a slip like 1e308 or 1e-300 is refused here, naming the field, instead of being stored.
     */
    public static Double thicknessOrNull(String field, String s) {
        OptionalDouble v = number(field, s);
        if (v.isEmpty()) {
            return null;
        }
        if (!PhysicalRanges.isThicknessMm(v.getAsDouble())) {
            throw new ImportRequestException(field, "a thickness must be from " + PhysicalRanges.MIN_THICKNESS_MM
                    + " mm (1 µm) to " + (long) PhysicalRanges.MAX_THICKNESS_MM + " mm, got " + s.strip());
        }
        return v.getAsDouble();
    }

    /**
     * A one-line text to be stored (a name, an instrument, a lot), stripped; null when blank. Refused, naming
     * the field, when longer than its column or holding a control or bidirectional control character
     * ({@link StoredText}).
     */
    public static String line(String field, String s, int maxLength) {
        return text(field, s, maxLength, false);
    }

    /** As {@link #line}, for a text that may run over several lines (a description, notes). */
    public static String paragraph(String field, String s, int maxLength) {
        return text(field, s, maxLength, true);
    }

    private static String text(String field, String s, int maxLength, boolean multiLine) {
        if (blank(s)) {
            return null;
        }
        String t = s.strip();
        try {
            return multiLine ? StoredText.paragraph(field, t, maxLength) : StoredText.line(field, t, maxLength);
        } catch (FieldException e) {
            throw new ImportRequestException(field, e.getMessage().substring(field.length() + 1));
        }
    }

    public static Optional<ImportFormat> format(String field, String s) {
        return blank(s) ? Optional.empty() : Optional.of(wrap(field, () -> ImportFormat.parse(s)));
    }

    /** {@code percent}, {@code fraction}, {@code absorbance} (also {@code od}), or the constant name. */
    public static Optional<YKind> yKind(String field, String s) {
        if (blank(s)) {
            return Optional.empty();
        }
        return Optional.of(switch (s.strip().toLowerCase(Locale.ROOT).replace('-', '_')) {
            case "percent", "%t", "transmittance_percent" -> YKind.TRANSMITTANCE_PERCENT;
            case "fraction", "transmittance", "transmittance_fraction" -> YKind.TRANSMITTANCE_FRACTION;
            case "absorbance", "od", "optical_density" -> YKind.ABSORBANCE;
            default -> throw new ImportRequestException(field, "'" + s + "' is not one of percent, fraction, absorbance");
        });
    }

    public static Optional<DecimalMark> decimalMark(String field, String s) {
        if (blank(s)) {
            return Optional.empty();
        }
        return Optional.of(switch (s.strip().toLowerCase(Locale.ROOT)) {
            case "point", "." -> DecimalMark.POINT;
            case "comma", "," -> DecimalMark.COMMA;
            default -> throw new ImportRequestException(field, "'" + s + "' is not one of point, comma");
        });
    }

    /** {@code nm}, {@code um}/{@code µm}, {@code angstrom}/{@code å}, {@code cm-1}, or the constant name. */
    public static Optional<XUnit> xUnit(String field, String s) {
        if (blank(s)) {
            return Optional.empty();
        }
        return Optional.of(switch (s.strip().toLowerCase(Locale.ROOT).replace('\u03bc', '\u00b5')) {
            case "nm", "nanometre", "nanometer", "nanometres", "nanometers" -> XUnit.NANOMETRE;
            case "um", "µm", "micrometre", "micrometer", "micrometres", "micrometers", "micron", "microns" ->
                    XUnit.MICROMETRE;
            case "angstrom", "angstroms", "å" -> XUnit.ANGSTROM;
            case "cm-1", "1/cm", "wavenumber", "wavenumber_per_cm" -> XUnit.WAVENUMBER_PER_CM;
            default -> throw new ImportRequestException(field, "'" + s + "' is not one of nm, um, angstrom, cm-1");
        });
    }

    /** A column counted from 1, as a spreadsheet shows it; empty when blank. */
    public static OptionalInt column(String field, String s) {
        if (blank(s)) {
            return OptionalInt.empty();
        }
        try {
            int c = Integer.parseInt(s.strip());
            if (c >= 1 && c <= 1024) {
                return OptionalInt.of(c);
            }
        } catch (NumberFormatException e) {
            // reported below
        }
        throw new ImportRequestException(field, "'" + s.strip() + "' is not a column number (1 for the first column)");
    }

    /**
     * The axis overrides (x unit, wavelength column, value column) added to {@code options}; the field names
     * are the caller's (HTTP form or manifest), so a refusal names the one the user wrote.
     */
    public static ImportOptions withAxes(ImportOptions options, String xUnitField, String xUnit, String xColumnField,
                                         String xColumn, String yColumnField, String yColumn) {
        Optional<XUnit> unit = xUnit(xUnitField, xUnit);
        OptionalInt x = column(xColumnField, xColumn);
        OptionalInt y = column(yColumnField, yColumn);
        if (x.isPresent() && x.equals(y)) {
            throw new ImportRequestException(yColumnField, xColumnField + " and " + yColumnField
                    + " must be different columns, both are " + x.getAsInt());
        }
        return options.withAxes(unit, x, y);
    }

    public static Replicates replicates(String field, String s) {
        if (blank(s)) {
            return Replicates.FIRST;
        }
        for (Replicates r : Replicates.values()) {
            if (r.name().equalsIgnoreCase(s.strip())) {
                return r;
            }
        }
        throw new ImportRequestException(field, "'" + s + "' is not one of first, mean, separate");
    }

    public static boolean bool(String field, String s) {
        if (blank(s)) {
            return false;
        }
        return switch (s.strip().toLowerCase(Locale.ROOT)) {
            case "true", "yes", "1", "on" -> true;
            case "false", "no", "0", "off" -> false;
            default -> throw new ImportRequestException(field, "'" + s + "' is not true or false");
        };
    }

    public static OptionalDouble number(String field, String s) {
        if (blank(s)) {
            return OptionalDouble.empty();
        }
        try {
            double v = Double.parseDouble(s.strip());
            if (!Double.isFinite(v)) {
                throw new NumberFormatException();
            }
            return OptionalDouble.of(v);
        } catch (NumberFormatException e) {
            throw new ImportRequestException(field, "'" + s + "' is not a number");
        }
    }

    public static Double positiveOrNull(String field, String s) {
        OptionalDouble v = number(field, s);
        if (v.isPresent() && !(v.getAsDouble() > 0)) {
            throw new ImportRequestException(field, "must be above 0, got " + s.strip());
        }
        return v.isPresent() ? v.getAsDouble() : null;
    }

    public static LocalDate date(String field, String s) {
        if (blank(s)) {
            return null;
        }
        try {
            return LocalDate.parse(s.strip());
        } catch (DateTimeParseException e) {
            throw new ImportRequestException(field, "'" + s + "' is not a date written as YYYY-MM-DD");
        }
    }

    public static Geometry geometry(String field, String s) {
        return blank(s) ? null : wrap(field, () -> Geometry.parse(s));
    }

    public static Provenance provenance(String field, String s) {
        return blank(s) ? null : wrap(field, () -> Provenance.parse(s));
    }

    public static Scaling scaling(String field, String s) {
        if (blank(s)) {
            throw new ImportRequestException(field, "a new material needs its scaling: bulk (rescaled by thickness) or"
                    + " fixed (a coating or laminate, used only as measured)");
        }
        return wrap(field, () -> Scaling.parse(s));
    }

    public static MaterialClass materialClass(String field, String s) {
        if (blank(s)) {
            throw new ImportRequestException(field, "a new material needs its class, e.g. one of " + MaterialClass.KNOWN);
        }
        return wrap(field, () -> MaterialClass.of(s));
    }

    /** The import options from their text forms; the field names are those of the HTTP form. */
    public static ImportOptions options(String format, String yKind, String decimalMark, String replicates,
                                        String mergeDuplicates, String detectionLimit, String strayLightFloor,
                                        String fullScale) {
        return wrap("options", () -> new ImportOptions(format("format", format), yKind("yKind", yKind),
                decimalMark("decimalMark", decimalMark), replicates("replicates", replicates),
                bool("mergeDuplicates", mergeDuplicates), number("detectionLimit", detectionLimit),
                number("strayLightFloor", strayLightFloor), number("fullScale", fullScale)));
    }

    /**
     * {@code options} keeping only {@code from..to} (nm, either may be blank), refused naming the field when
     * not a wavelength or when {@code from} is not shorter than {@code to}. The field names are given because
     * the HTTP form says {@code from}/{@code to} and so does the manifest.
     */
    public static ImportOptions keepRange(ImportOptions options, String fromField, String from, String toField,
                                          String to) {
        OptionalDouble fromNm = number(fromField, from);
        OptionalDouble toNm = number(toField, to);
        try {
            return options.withKeepRange(fromNm, toNm);
        } catch (IllegalArgumentException e) {
            // ImportOptions says "from must be …" or "to must be …": name the field it names
            boolean aboutTo = e.getMessage().startsWith("to ");
            throw new ImportRequestException(aboutTo ? toField : fromField, e.getMessage());
        }
    }

    /**
     * The options with the JCAMP-DX block choice added: {@code block} a block number as the preview lists it,
     * {@code eachBlock} true to store every block as its own sample; the field names are those to name in a
     * refusal (HTTP form or manifest column).
     */
    public static ImportOptions withBlocks(ImportOptions options, String blockField, String block, String eachField,
                                           String each) {
        java.util.OptionalInt chosen = blockNumber(blockField, block);
        boolean all = bool(eachField, each);
        if (chosen.isPresent() && all) {
            throw new ImportRequestException(blockField, "give " + blockField + " (one block) or " + eachField
                    + " (every block), not both");
        }
        return options.withBlocks(chosen, all);
    }

    /** A JCAMP-DX block number as the preview lists it (0 or more); empty when blank. */
    public static java.util.OptionalInt blockNumber(String field, String s) {
        if (blank(s)) {
            return java.util.OptionalInt.empty();
        }
        try {
            int n = Integer.parseInt(s.strip());
            if (n >= 0) {
                return java.util.OptionalInt.of(n);
            }
        } catch (NumberFormatException e) {
            // reported below
        }
        throw new ImportRequestException(field, "'" + s.strip() + "' is not a block number as the preview lists them"
                + " (0, 1, 2, …)");
    }

    /**
     * An instrument's stated uncertainty (one standard deviation) as written: {@code 0.5%T}, {@code 0.5 %},
     * {@code 0.01A}, {@code 0.01 abs}, {@code 0.01 OD}; the unit is required, since 0.5 %T and 0.5 A differ by
     * far more than any typo should. Blank: none stated.
     */
    public static Optional<StatedUncertainty> statedUncertainty(String field, String s) {
        if (blank(s)) {
            return Optional.empty();
        }
        var m = STATED_UNCERTAINTY.matcher(s.strip().toLowerCase(Locale.ROOT));
        if (!m.matches()) {
            throw new ImportRequestException(field, "'" + s + "' is not an uncertainty like '0.5%T' (percent"
                    + " transmittance) or '0.01A' (absorbance): a number and its unit");
        }
        double amount = Double.parseDouble(m.group(1).replace(',', '.'));
        StatedUncertainty.Scale scale = m.group(2).startsWith("%") ? StatedUncertainty.Scale.PERCENT_T
                : StatedUncertainty.Scale.ABSORBANCE;
        return Optional.of(wrap(field, () -> new StatedUncertainty(amount, scale)));
    }

    private static final java.util.regex.Pattern STATED_UNCERTAINTY = java.util.regex.Pattern.compile(
            "(?:±|\\+/-|\\+-)?\\s*([0-9]*[.,]?[0-9]+(?:e-?[0-9]+)?)\\s*(%\\s*t?|a|abs|absorbance|od)");

    private interface Parse<T> {
        T get();
    }

    private static <T> T wrap(String field, Parse<T> parse) {
        try {
            return parse.get();
        } catch (ImportRequestException e) {
            throw e;
        } catch (IllegalArgumentException e) {
            String message = e.getMessage();
            // ImportOptions names its own field first ("detectionLimit must be ..."); keep that name
            String named = message.split(" ", 2)[0];
            throw new ImportRequestException(field.equals("options") ? named : field, message);
        }
    }
}

package org.spectralsieve.importers;

import java.time.DateTimeException;
import java.time.LocalDate;
import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.Objects;
import java.util.Optional;
import java.util.regex.Matcher;
import java.util.regex.Pattern;

/**
 * What a file says about its specimen and measurement, read from its metadata lines: the thickness
 * ({@code # thickness: 3.0 mm}, {@code # thickness_mm: 3}, JCAMP-DX {@code ##PATH LENGTH=}), the instrument
 * ({@code # instrument:}, JCAMP-DX {@code ##SPECTROMETER/DATA SYSTEM=}) and the date of measurement
 * ({@code # date: 2026-03-09}, JCAMP-DX {@code ##LONGDATE=} or {@code ##DATE=}). Keys compare ignoring case,
 * blanks, underscores, dashes, dots and slashes, as JCAMP-DX compares its labels.
 *
 * <p>A value that is there but cannot be used is never dropped in silence: it is kept as written
 * ({@link Thickness#asWritten}, {@link #dateAsWritten}) and a note says why it was not used, so that no
 * message can say the file gives no thickness when it gives one.
 *
 * @param thickness  the thickness the file gives, usable or not; empty when it gives none
 * @param instrument the instrument as written; empty when none
 * @param date       the date of measurement, when written in a form that is not ambiguous
 * @param dateAsWritten the date text as written, also when it could not be read
 * @param notes      one line for each value that is there but was not understood
 */
public record SampleMetadata(Optional<Thickness> thickness, Optional<String> instrument, Optional<LocalDate> date,
        Optional<String> dateAsWritten, List<String> notes) {

    /**
     * One thickness as the file gives it.
     *
     * @param key       the metadata key as read (lower-cased), e.g. {@code thickness} or {@code path length}
     * @param asWritten the value as written, e.g. {@code 3.0 mm}
     * @param mm        the thickness in mm; NaN when the text is not a length (see {@code problem})
     * @param problem   why it cannot be used; empty when it can
     */
    public record Thickness(String key, String asWritten, double mm, Optional<String> problem) {
        public Thickness {
            Objects.requireNonNull(key, "key");
            Objects.requireNonNull(asWritten, "asWritten");
            Objects.requireNonNull(problem, "problem");
        }

        public boolean usable() {
            return problem.isEmpty();
        }

        /** As the file wrote it, for messages: {@code thickness: 3.0 mm}. */
        public String quoted() {
            return key + ": " + asWritten;
        }
    }

    /** Keys in order of preference, canonical form, with the unit a bare number is in (null: none assumed). */
    private static final List<String[]> THICKNESS_KEYS = List.of(
            new String[] {"thicknessmm", "mm"}, new String[] {"thicknessum", "µm"}, new String[] {"thicknessµm", "µm"},
            new String[] {"thickness", null}, new String[] {"samplethickness", null},
            // JCAMP-DX: "path length in cm" (JCAMP-DX IR specification, from memory)
            new String[] {"pathlength", "cm"});
    private static final List<String> INSTRUMENT_KEYS = List.of("instrument", "spectrometer", "spectrophotometer",
            "spectrometerdatasystem");
    private static final List<String> DATE_KEYS = List.of("measuredon", "measurementdate", "datemeasured", "longdate",
            "date");

    private static final Pattern LENGTH = Pattern.compile("([0-9]*[.,]?[0-9]+(?:[eE][-+]?[0-9]+)?)\\s*([a-zµμ]*)\\.?",
            Pattern.CASE_INSENSITIVE);
    private static final Pattern YEAR_FIRST = Pattern.compile("(\\d{4})[-/.](\\d{1,2})[-/.](\\d{1,2})(?:[T\\s].*)?");
    private static final Pattern YEAR_LAST = Pattern.compile("(\\d{1,2})[-/.](\\d{1,2})[-/.](\\d{4})(?:\\s.*)?");
    private static final Pattern TWO_DIGIT = Pattern.compile("(\\d{2})/(\\d{1,2})/(\\d{1,2})(?:\\s.*)?");
    private static final Pattern DAY_MONTH_NAME = Pattern.compile("(\\d{1,2})[ -]([A-Za-z]{3,9})\\.?[ -](\\d{4})(?:\\s.*)?");
    private static final Pattern MONTH_NAME_DAY = Pattern.compile("([A-Za-z]{3,9})\\.? (\\d{1,2}),? (\\d{4})(?:\\s.*)?");
    private static final List<String> MONTHS = List.of("jan", "feb", "mar", "apr", "may", "jun", "jul", "aug", "sep",
            "oct", "nov", "dec");

    public SampleMetadata {
        Objects.requireNonNull(thickness, "thickness");
        Objects.requireNonNull(instrument, "instrument");
        Objects.requireNonNull(date, "date");
        Objects.requireNonNull(dateAsWritten, "dateAsWritten");
        notes = List.copyOf(notes);
    }

    /** Reads the metadata of a {@link ParsedSpectrum} (keys lower-cased, values as written). */
    public static SampleMetadata of(Map<String, String> metadata) {
        List<String> notes = new ArrayList<>();
        Optional<Thickness> thickness = Optional.empty();
        for (String[] key : THICKNESS_KEYS) {
            Optional<Map.Entry<String, String>> e = find(metadata, key[0]);
            if (e.isPresent() && !e.get().getValue().isBlank()) {
                thickness = Optional.of(thickness(e.get().getKey(), e.get().getValue().strip(), key[1]));
                break;
            }
        }
        if (thickness.isPresent() && !thickness.get().usable()) {
            notes.add("the file's thickness (" + thickness.get().quoted() + ") is not used: "
                    + thickness.get().problem().orElseThrow());
        }
        Optional<String> instrument = Optional.empty();
        for (String key : INSTRUMENT_KEYS) {
            instrument = find(metadata, key).map(e -> e.getValue().strip()).filter(v -> !v.isEmpty());
            if (instrument.isPresent()) {
                break;
            }
        }
        Optional<String> dateText = Optional.empty();
        String dateKey = null;
        for (String key : DATE_KEYS) {
            Optional<Map.Entry<String, String>> e = find(metadata, key).filter(x -> !x.getValue().isBlank());
            if (e.isPresent()) {
                dateText = Optional.of(e.get().getValue().strip());
                dateKey = e.get().getKey();
                break;
            }
        }
        Optional<LocalDate> date = Optional.empty();
        if (dateText.isPresent()) {
            try {
                date = Optional.of(date(dateText.get()));
            } catch (IllegalArgumentException e) {
                notes.add("the file's date (" + dateKey + ": " + dateText.get() + ") is not used: " + e.getMessage());
            }
        }
        return new SampleMetadata(thickness, instrument, date, dateText, notes);
    }

    private static Optional<Map.Entry<String, String>> find(Map<String, String> metadata, String canonical) {
        return metadata.entrySet().stream().filter(e -> canonical(e.getKey()).equals(canonical)).findFirst();
    }

    /** Lower case without blanks, underscores, dashes, dots and slashes: "Path Length" = "path_length". */
    static String canonical(String key) {
        return key.toLowerCase(Locale.ROOT).replace('\u03bc', '\u00b5').replaceAll("[\\s_\\-./]", "");
    }

    /**
     * {@code 3.0 mm}, {@code 125 µm}, {@code 0.3 cm}, {@code 3,0 mm}; a bare number only where the key says
     * its unit ({@code thickness_mm}, JCAMP-DX path length in cm).
     */
    static Thickness thickness(String key, String text, String keyUnit) {
        Matcher m = LENGTH.matcher(text.strip());
        if (!m.matches()) {
            return new Thickness(key, text, Double.NaN, Optional.of("not a length such as '3.0 mm' or '125 µm'"));
        }
        double v = Double.parseDouble(m.group(1).replace(',', '.'));
        String unit = m.group(2).isEmpty() ? keyUnit : m.group(2).toLowerCase(Locale.ROOT).replace('\u03bc', '\u00b5');
        if (unit == null) {
            return new Thickness(key, text, Double.NaN, Optional.of("no unit; write it as '" + text.strip()
                    + " mm' (or µm, cm), or give the thickness with the import"));
        }
        double perMm = switch (unit) {
            case "mm" -> 1;
            case "µm", "um", "micron", "microns" -> 1000;
            case "cm" -> 0.1;
            case "m" -> 0.001;
            default -> Double.NaN;
        };
        if (Double.isNaN(perMm)) {
            return new Thickness(key, text, Double.NaN, Optional.of("unit '" + m.group(2) + "' is not mm, µm, cm or m"));
        }
        double mm = v / perMm;
        if (!(mm > 0) || !Double.isFinite(mm)) {
            return new Thickness(key, text, Double.NaN, Optional.of("a thickness must be above 0"));
        }
        return new Thickness(key, text, mm, Optional.empty());
    }

    /**
     * A date in a form that is not ambiguous: {@code 2026-03-09} or {@code 2016/11/22} (year first, time after
     * it ignored), {@code 28/8/2023} (a day above 12 first, or a month above 12 second), {@code 91/06/18}
     * (JCAMP-DX 4.24 YY/MM/DD, recognised by a first number above 31; 50–99 are 1950–1999),
     * {@code 20 Mar 2009}, {@code March 20, 2009}.
     *
     * @throws IllegalArgumentException saying why when the text is not such a date
     */
    static LocalDate date(String text) {
        String t = text.strip();
        try {
            Matcher m = YEAR_FIRST.matcher(t);
            if (m.matches()) {
                return LocalDate.of(num(m, 1), num(m, 2), num(m, 3));
            }
            m = YEAR_LAST.matcher(t);
            if (m.matches()) {
                int a = num(m, 1);
                int b = num(m, 2);
                if (a > 12 || a == b) {
                    return LocalDate.of(num(m, 3), b, a);
                }
                if (b > 12) {
                    return LocalDate.of(num(m, 3), a, b);
                }
                throw new IllegalArgumentException("day and month cannot be told apart; write it as YYYY-MM-DD");
            }
            m = TWO_DIGIT.matcher(t);
            if (m.matches()) {
                int yy = num(m, 1);
                if (yy > 31) {
                    return LocalDate.of(yy >= 50 ? 1900 + yy : 2000 + yy, num(m, 2), num(m, 3));
                }
                throw new IllegalArgumentException("a two-digit year cannot be told from the day; write it as YYYY-MM-DD");
            }
            m = DAY_MONTH_NAME.matcher(t);
            if (m.matches()) {
                return LocalDate.of(num(m, 3), month(m.group(2)), num(m, 1));
            }
            m = MONTH_NAME_DAY.matcher(t);
            if (m.matches()) {
                return LocalDate.of(num(m, 3), month(m.group(1)), num(m, 2));
            }
        } catch (DateTimeException e) {
            throw new IllegalArgumentException("not a date in the calendar (" + e.getMessage() + ")");
        }
        throw new IllegalArgumentException("not a date such as 2026-03-09");
    }

    private static int num(Matcher m, int group) {
        return Integer.parseInt(m.group(group));
    }

    private static int month(String name) {
        String n = name.toLowerCase(Locale.ROOT);
        int i = n.length() >= 3 ? MONTHS.indexOf(n.substring(0, 3)) : -1;
        if (i < 0) {
            throw new IllegalArgumentException("'" + name + "' is not an English month name");
        }
        return i + 1;
    }
}

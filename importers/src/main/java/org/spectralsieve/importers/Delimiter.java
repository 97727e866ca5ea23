package org.spectralsieve.importers;

import java.io.IOException;
import java.io.StringReader;
import java.io.UncheckedIOException;
import java.util.ArrayList;
import java.util.List;
import java.util.Optional;
import org.apache.commons.csv.CSVFormat;
import org.apache.commons.csv.CSVParser;
import org.apache.commons.csv.CSVRecord;

/**
 * How fields are separated, detected once per file from the header line and the first data line, and
 * then used for the whole file.
 *
 * <p>Detection tries, in this order, semicolon, tab, comma and runs of blanks, each with a decimal
 * point and then a decimal comma (never a comma inside comma-separated fields), and takes the first
 * combination that splits the first data line into at least two numbers and the header into as many
 * names. So {@code 365,5;12,3} is semicolon with decimal comma, {@code 365.5,12.3} is comma, and
 * {@code 365,5 12,3} is blanks with decimal comma. Tab-separated files whose header and first row also
 * split on blanks are read as blanks, because hand-edited files mix tabs and spaces; the blanks mode
 * accepts both. When nothing fits, the old rule picks the delimiter (comma, semicolon, tab, blanks: the
 * first present) and the row reader reports the bad field.
 *
 * <p>Comma, semicolon and tab lines holding a double quote are tokenised by commons-csv (so quoted
 * header names work); others are split in place, which gives the same fields far faster. A quoted
 * field cannot span lines, since data are read one line at a time to keep line numbers exact.
 */
enum Delimiter {
    COMMA(','),
    SEMICOLON(';'),
    TAB('\t'),
    WHITESPACE(' ');

    private final char symbol;
    private final CSVFormat format;

    Delimiter(char symbol) {
        this.symbol = symbol;
        this.format = CSVFormat.DEFAULT.builder()
                .setDelimiter(symbol)
                .setIgnoreSurroundingSpaces(true)
                .setTrim(true)
                .get();
    }

    /** A delimiter and decimal mark that fit the file. */
    record Choice(Delimiter delimiter, DecimalMark decimal) {
    }

    private static final Delimiter[] ORDER = {SEMICOLON, TAB, COMMA, WHITESPACE};

    /**
     * @param header   the header line, or null when the file has none
     * @param dataLine the first data line
     * @param forced   the decimal mark the user set, if any
     */
    static Choice detect(String header, String dataLine, Optional<DecimalMark> forced) {
        LineFields data = new LineFields();
        Choice firstFit = null;
        for (Delimiter d : ORDER) {
            for (DecimalMark mark : DecimalMark.values()) {
                if (forced.isPresent() && forced.get() != mark || d == COMMA && mark == DecimalMark.COMMA) {
                    continue;
                }
                if (!d.splitsIntoNumbers(dataLine, data, mark.symbol())) {
                    continue;
                }
                Choice choice = new Choice(d, mark);
                if (d == TAB && WHITESPACE.fits(header, dataLine, mark, data)) {
                    choice = new Choice(WHITESPACE, mark);
                }
                if (header == null || choice.delimiter().headerCount(header) == data.count()) {
                    return choice;
                }
                if (firstFit == null) {
                    firstFit = choice;
                }
            }
        }
        return firstFit != null ? firstFit
                : new Choice(simple(header != null ? header : dataLine), forced.orElse(DecimalMark.POINT));
    }

    private boolean fits(String header, String dataLine, DecimalMark mark, LineFields data) {
        int tabCount = data.count();
        boolean fits = splitsIntoNumbers(dataLine, data, mark.symbol()) && data.count() == tabCount
                && (header == null || headerCount(header) == tabCount);
        TAB.splitSafely(dataLine, data); // restore the tab split for the caller
        return fits;
    }

    private boolean splitsIntoNumbers(String line, LineFields fields, char decimal) {
        if (splitSafely(line, fields) < 2) {
            return false;
        }
        for (int i = 0; i < fields.count(); i++) {
            if (!fields.isNumber(i, decimal)) {
                return false;
            }
        }
        return true;
    }

    private int splitSafely(String line, LineFields fields) {
        try {
            split(line, fields);
            return fields.count();
        } catch (IllegalArgumentException e) {
            return -1;
        }
    }

    /** The rule before data-based detection: the first delimiter character present. */
    static Delimiter simple(String line) {
        if (line.indexOf(',') >= 0) {
            return COMMA;
        }
        if (line.indexOf(';') >= 0) {
            return SEMICOLON;
        }
        if (line.indexOf('\t') >= 0) {
            return TAB;
        }
        return WHITESPACE;
    }

    /**
     * Splits one non-blank line into trimmed fields held by {@code fields}.
     *
     * @throws IllegalArgumentException when the line cannot be tokenised (e.g. an unclosed quote)
     */
    void split(String line, LineFields fields) {
        fields.reset(line);
        if (this == WHITESPACE) {
            splitBlanks(line, fields);
        } else if (line.indexOf('"') < 0) {
            int start = 0;
            for (int end; (end = line.indexOf(symbol, start)) >= 0; start = end + 1) {
                fields.add(start, end);
            }
            fields.add(start, line.length());
        } else {
            fields.setQuoted(splitQuoted(line));
        }
    }

    private static void splitBlanks(String line, LineFields fields) {
        int n = line.length();
        int i = 0;
        while (true) {
            while (i < n && LineFields.isBlank(line.charAt(i))) {
                i++;
            }
            if (i == n) {
                return;
            }
            int start = i;
            while (i < n && !LineFields.isBlank(line.charAt(i))) {
                i++;
            }
            fields.add(start, i);
        }
    }

    private List<String> splitQuoted(String line) {
        try (CSVParser parser = format.parse(new StringReader(line))) {
            List<CSVRecord> records = parser.getRecords();
            if (records.size() != 1) {
                throw new IllegalArgumentException("not a single record");
            }
            List<String> fields = new ArrayList<>(records.get(0).size());
            records.get(0).forEach(fields::add);
            return fields;
        } catch (IOException | UncheckedIOException e) {
            throw new IllegalArgumentException("cannot split into fields: " + e.getMessage(), e);
        }
    }

    /**
     * Header names. Blank-separated headers join a bracketed unit to the name before it, so that
     * {@code Wavelength [nm] Transmittance (%)} gives two names, not four.
     */
    List<String> splitHeader(String line) {
        LineFields fields = new LineFields();
        split(line, fields);
        List<String> names = new ArrayList<>(fields.count());
        for (int i = 0; i < fields.count(); i++) {
            String name = fields.text(i);
            boolean unit = name.startsWith("(") || name.startsWith("[");
            if (this == WHITESPACE && unit && !names.isEmpty()) {
                names.set(names.size() - 1, names.get(names.size() - 1) + " " + name);
            } else {
                names.add(name);
            }
        }
        return names;
    }

    /** Field count of the header as {@link #splitHeader} reads it. */
    int headerCount(String line) {
        try {
            return splitHeader(line).size();
        } catch (IllegalArgumentException e) {
            return -1;
        }
    }

    String describe() {
        return this == WHITESPACE ? "spaces" : this == TAB ? "tab" : "'" + symbol + "'";
    }
}

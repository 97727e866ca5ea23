package org.spectralsieve.importers;

import java.io.IOException;
import java.io.StringReader;
import java.io.UncheckedIOException;
import java.util.ArrayList;
import java.util.List;
import java.util.regex.Pattern;
import org.apache.commons.csv.CSVFormat;
import org.apache.commons.csv.CSVParser;
import org.apache.commons.csv.CSVRecord;

/**
 * How fields are separated, detected once from the first header or data line and then used for the
 * whole file. Detection is deliberately simple, in this order: a comma anywhere in the line means
 * comma; else a semicolon means semicolon; else a tab means tab; else runs of spaces. Runs-of-spaces
 * mode also accepts tabs, because hand-edited text files often mix the two.
 *
 * <p>Comma, semicolon and tab lines holding a double quote are tokenised by commons-csv (so quoted header
 * names work); others are split directly, which gives the same fields faster. A quoted
 * field cannot span lines, since data are read one line at a time to keep line numbers exact.
 */
enum Delimiter {
    COMMA(','),
    SEMICOLON(';'),
    TAB('\t'),
    WHITESPACE(' ');

    private static final Pattern BLANKS = Pattern.compile("[ \\t]+");

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

    static Delimiter detect(String line) {
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
     * Splits one non-blank line into trimmed fields.
     *
     * @throws IllegalArgumentException when the line cannot be tokenised (e.g. an unclosed quote)
     */
    List<String> split(String line) {
        if (this == WHITESPACE) {
            return List.of(BLANKS.split(line.strip()));
        }
        if (line.indexOf('"') < 0) {
            return splitUnquoted(line);
        }
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
     * Without quotes a plain split gives the same fields as commons-csv; a parser per line costs about
     * ten times more, which matters for curves near the row cap.
     */
    private List<String> splitUnquoted(String line) {
        List<String> fields = new ArrayList<>(4);
        int start = 0;
        for (int end; (end = line.indexOf(symbol, start)) >= 0; start = end + 1) {
            fields.add(line.substring(start, end).strip());
        }
        fields.add(line.substring(start).strip());
        return fields;
    }

    String describe() {
        return this == WHITESPACE ? "spaces" : this == TAB ? "tab" : "'" + symbol + "'";
    }
}

package org.spectralsieve.requirement;

import java.util.ArrayList;
import java.util.Arrays;
import java.util.Collection;
import java.util.List;
import java.util.Locale;
import java.util.Set;
import org.spectralsieve.requirement.Token.Kind;

/**
 * Words about the stock written with a requirement, split from its clauses:
 * {@code clear acrylic passes over 80% at 400 nm} is the words "clear acrylic" and the requirement
 * "passes over 80% at 400 nm"; {@code provenance measured and blocks under 1% at 405 nm} is a provenance
 * term and the requirement. The library's text index admits the materials the words and terms name; the
 * clauses are then judged on those alone (docs/library-search.md, "Words with a requirement").
 *
 * <ul>
 *   <li><b>Words</b>: the words that stand before the first token that starts a requirement item (a keyword
 *       such as {@code passes}, {@code cutoff}, {@code class}, {@code at}, a number or a comparison). Only
 *       letters (and inner hyphens) make a word; a comma or {@code and} between the words and the first
 *       clause is a separator.</li>
 *   <li><b>Provenance terms</b>: {@code provenance X} (X one of the values the caller names), among the
 *       leading words or as an item of its own joined by {@code ,} or {@code and}. The requirement language
 *       has no provenance filter; the index has the facet. {@code class X} and {@code geometry X} stay in the
 *       requirement, which filters by them as before.</li>
 * </ul>
 *
 * <p>The split keeps positions: {@link #maskedText} is the text with the words and terms replaced by
 * spaces, so a syntax error in the clauses points at the same character of what the user typed. A text
 * without words or terms is returned unchanged ({@link #any} false), so it is read exactly as before.
 *
 * @param words       the leading words as typed, single-spaced, "" for none
 * @param provenances the provenance values named, lower case, in order
 * @param maskedText  the text with words and terms blanked out (same length)
 * @param typos       leading words one or two letter edits from a keyword that starts an item (what the
 *                    parser would suggest): the caller asks the index, and a word that admits nothing is
 *                    reported as the typing slip it most likely is
 */
public record RequirementWords(String words, List<String> provenances, String maskedText, List<Slip> typos) {

    /** A leading word that may be a slip for {@code keyword}; {@code start} is its offset in the text. */
    public record Slip(String word, int start, String keyword) {
    }

    /**
     * The words that start a requirement item (RequirementParser's item switch and its "did you mean" list):
     * a leading word equal to one of them ends the words.
     */
    static final Set<String> ITEM_STARTS = Set.of("passes", "pass", "blocks", "block", "transmits", "transmit",
            "transmittance", "t", "mean", "od", "over", "above", "under", "below", "more", "less", "cutoff", "cut-off",
            "erythemal", "uv", "uv-hazard", "luminous", "visible", "vlt", "critical", "behind", "on", "thickness",
            "class", "material", "geometry", "at", "from", "between", "after", "printed", "base", "unprinted", "as");
    /** Keywords a slip is looked for against: the longer clause words (a slip for "t" or "on" is just a word). */
    private static final List<String> SLIP_KEYWORDS = Arrays.asList("passes", "blocks", "transmits", "transmittance",
            "printed",
            "cutoff", "erythemal", "luminous", "visible", "critical", "thickness", "geometry", "behind", "under", "over",
            "below", "above");
    static final String PROVENANCE = "provenance";

    public RequirementWords {
        provenances = List.copyOf(provenances);
        typos = List.copyOf(typos);
    }

    /** Whether any words or terms were written (else the requirement is read exactly as without this split). */
    public boolean any() {
        return !words.isEmpty() || !provenances.isEmpty();
    }

    /**
     * @param text            the requirement text as typed
     * @param provenanceNames the values a provenance term may name ("measured", "datasheet", "modelled")
     * @throws RequirementSyntaxException for a symbol the language does not know, a provenance term without
     *                                    a value, or a value not among {@code provenanceNames}
     */
    public static RequirementWords split(String text, Collection<String> provenanceNames) {
        if (text == null) {
            return new RequirementWords("", List.of(), null, List.of());
        }
        RequirementLimits.checkTextLength(text);
        List<Token> tokens = Tokenizer.tokenize(text);
        char[] masked = text.toCharArray();
        List<String> words = new ArrayList<>();
        List<String> provenances = new ArrayList<>();
        List<Slip> slips = new ArrayList<>();
        int i = 0;
        while (true) {
            Token t = tokens.get(i);
            if (t.isWord(PROVENANCE)) {
                i = term(tokens, i, masked, provenances, provenanceNames, true);
            } else if ((t.kind() == Kind.COMMA || t.isWord("and")) && (!words.isEmpty() || !provenances.isEmpty())
                    && startsItem(tokens.get(i + 1))) {
                blank(masked, t.start(), t.end()); // the separator between the words and the first clause
                i++;
                break;
            } else if (t.kind() == Kind.WORD && !startsItem(t)) {
                words.add(t.text());
                blank(masked, t.start(), t.end());
                Slip slip = slip(t);
                if (slip != null) {
                    slips.add(slip);
                }
                i++;
            } else {
                break;
            }
        }
        // later provenance terms are items of their own: after a separator, ended by one or the end
        for (int j = i + 1; j < tokens.size(); j++) {
            Token previous = tokens.get(j - 1);
            if (tokens.get(j).isWord(PROVENANCE) && (previous.kind() == Kind.COMMA || previous.isWord("and"))) {
                blank(masked, previous.start(), previous.end());
                j = term(tokens, j, masked, provenances, provenanceNames, false) - 1;
            }
        }
        return new RequirementWords(String.join(" ", words), provenances, new String(masked), slips);
    }

    /** Reads "provenance X" at {@code at}, blanks it, and returns the index of the token after it. */
    private static int term(List<Token> tokens, int at, char[] masked, List<String> out, Collection<String> names,
                            boolean leading) {
        Token word = tokens.get(at);
        Token value = tokens.get(at + 1);
        if (value.kind() != Kind.WORD || !names.contains(value.lower())) {
            String expected = "a provenance (" + String.join(", ", names) + ") after 'provenance'";
            String suggestion = value.kind() == Kind.WORD ? near(value.lower(), names) : null;
            throw new RequirementSyntaxException(value.start(), expected, value.quoted(), suggestion);
        }
        Token after = tokens.get(at + 2);
        if (!leading && after.kind() != Kind.END && after.kind() != Kind.COMMA && !after.isWord("and")) {
            throw new RequirementSyntaxException(after.start(), "',' or 'and' after '" + word.text() + " " + value.text()
                    + "'", after.quoted(), null);
        }
        out.add(value.lower());
        blank(masked, word.start(), value.end());
        return at + 2;
    }

    static boolean startsItem(Token t) {
        return switch (t.kind()) {
            case NUMBER, AT_LEAST, AT_MOST, DASH, PERCENT, END -> true;
            case WORD -> ITEM_STARTS.contains(t.lower());
            case COMMA -> false;
        };
    }

    /** The keyword the word is a likely slip for, by the parser's own rule ({@link Expected#suggestionFor}). */
    private static Slip slip(Token word) {
        String keyword = Expected.keywords(SLIP_KEYWORDS.toArray(String[]::new)).suggestionFor(word);
        return keyword == null ? null : new Slip(word.text(), word.start(), keyword);
    }

    private static String near(String word, Collection<String> names) {
        int allowed = word.length() <= 4 ? 1 : 2;
        return names.stream().filter(n -> EditDistance.between(word, n.toLowerCase(Locale.ROOT), allowed) <= allowed)
                .findFirst().orElse(null);
    }

    private static void blank(char[] masked, int from, int to) {
        Arrays.fill(masked, from, to, ' ');
    }
}

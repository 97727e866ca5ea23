package org.spectralsieve.requirement;

import java.util.ArrayList;
import java.util.Comparator;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.Optional;
import java.util.function.Function;
import java.util.regex.Pattern;
import org.spectralsieve.requirement.Token.Kind;
import org.spectralsieve.weighting.Emitter;
import org.spectralsieve.weighting.EmitterCatalogue;
import org.spectralsieve.weighting.Response;
import org.spectralsieve.weighting.SpectrumLookup;

/**
 * Emitter and response names as a requirement text writes them. A name matches when its words agree,
 * whatever separates them and in any case: "led 365", "LED-365" and "led365" all name {@code led-365}
 * (letters and digits are separate words, everything else separates). The longest matching run of words
 * wins, so a name that extends another is reachable. Names come from the {@link SpectrumLookup} the text
 * is read with, so imported spectra are named like built-in ones.
 */
final class SpectrumNames {

    /** How many names an error message lists before "…". */
    private static final int LISTED = 12;
    /** Tokens a described emitter can take: "mercury 1 - 0.5 - 0.2 - 0.1" is nine. */
    private static final int DESCRIBED_WORDS = 9;
    private static final Pattern LETTER_DIGIT = Pattern.compile("(?<=\\p{L})(?=\\p{N})|(?<=\\p{N})(?=\\p{L})");
    private static final Pattern SEPARATORS = Pattern.compile("[^\\p{L}\\p{N}.]+");

    private final TokenCursor in;
    private final SpectrumLookup spectra;

    SpectrumNames(TokenCursor in, SpectrumLookup spectra) {
        this.in = in;
        this.spectra = spectra;
    }

    /** "LED-365" → "led 365". */
    static String key(String name) {
        String spaced = LETTER_DIGIT.matcher(name.toLowerCase(Locale.ROOT)).replaceAll(" ");
        return SEPARATORS.matcher(spaced).replaceAll(" ").strip();
    }

    /** Whether a listed emitter's name starts with this word ("uv" for an imported "UV lamp"). */
    boolean emitterStartsWith(String word) {
        return spectra.emitters().stream().map(e -> key(e.name()))
                .anyMatch(k -> k.equals(word) || k.startsWith(word + " "));
    }

    /** A listed emitter, else one its words describe ("led 370 20", see {@link EmitterCatalogue#parametric}). */
    Emitter emitter(String after) {
        return read(spectra.emitters(), Emitter::name, EmitterCatalogue::parametric,
                "an emitter", " or a described one: " + EmitterCatalogue.PARAMETRIC_FORMS, after);
    }

    Response response(String after) {
        return read(spectra.responses(), Response::name, written -> Optional.empty(), "a response", "", after);
    }

    private <T> T read(List<T> known, Function<T, String> name, Function<String, Optional<T>> described,
                       String what, String otherForms, String after) {
        Map<String, T> byKey = new LinkedHashMap<>();
        int longest = 1;
        for (T item : known) {
            String key = key(name.apply(item));
            byKey.putIfAbsent(key, item);
            longest = Math.max(longest, key.split(" ").length);
        }
        Token first = in.peek();
        List<Token> run = run(2 * longest + 1);
        int listedLength = 0;
        T listed = null;
        for (int length = run.size(); length >= 1 && listed == null; length--) {
            if (run.get(length - 1).kind() != Kind.DASH) {
                listed = byKey.get(key(words(run.subList(0, length))));
                listedLength = listed == null ? 0 : length;
            }
        }
        // A described name ("led 395 10 16") may extend a listed one ("led 395"): the longer reading wins.
        List<Token> longer = run(DESCRIBED_WORDS);
        for (int length = longer.size(); length > listedLength; length--) {
            if (longer.get(length - 1).kind() != Kind.DASH) {
                Optional<T> match = described.apply(key(words(longer.subList(0, length))));
                if (match.isPresent()) {
                    return consume(length, match.get());
                }
            }
        }
        if (listed != null) {
            return consume(listedLength, listed);
        }
        throw unknown(first, known.stream().map(name).toList(), what, otherForms, after);
    }

    private <T> T consume(int tokens, T match) {
        for (int i = 0; i < tokens; i++) {
            in.next();
        }
        return match;
    }

    /** The tokens that could belong to a name: words, numbers and dashes, at most {@code max}. */
    private List<Token> run(int max) {
        List<Token> run = new ArrayList<>();
        for (int i = 0; i < max; i++) {
            Token t = in.peek(i);
            if (t.kind() != Kind.WORD && t.kind() != Kind.NUMBER && t.kind() != Kind.DASH) {
                break;
            }
            run.add(t);
        }
        return run;
    }

    private static String words(List<Token> tokens) {
        StringBuilder b = new StringBuilder();
        for (Token t : tokens) {
            b.append(t.text()).append(' ');
        }
        return b.toString();
    }

    /** The phrase the user wrote (up to a separator or "weighted"), the known names, and the close ones. */
    private RequirementSyntaxException unknown(Token first, List<String> names, String what, String otherForms,
                                               String after) {
        List<Token> phrase = new ArrayList<>();
        for (Token t : run(40)) {
            if (t.isWord("and") || t.isWord("weighted")) {
                break;
            }
            phrase.add(t);
        }
        String listed = names.size() <= LISTED ? String.join(", ", names)
                : String.join(", ", names.subList(0, LISTED)) + ", …";
        String expected = what + " name (" + listed + ")" + otherForms + " after '" + after + "'";
        if (phrase.isEmpty()) {
            return new RequirementSyntaxException(first.start(), 0, expected, first.quoted(), List.of(), false);
        }
        Token last = phrase.get(phrase.size() - 1);
        String written = in.text().substring(first.start(), last.end());
        return new RequirementSyntaxException(first.start(), last.end() - first.start(), expected,
                "'" + written + "'", closest(key(written), names), true);
    }

    /** Names within a few edits of the written words (a third of their length, 1 to 3), closest first. */
    static List<String> closest(String writtenKey, List<String> names) {
        int allowed = Math.max(1, Math.min(3, writtenKey.length() / 3));
        record Near(String name, int distance) {
        }
        List<Near> near = new ArrayList<>();
        for (String name : names) {
            int d = EditDistance.between(writtenKey, key(name), allowed);
            if (d <= allowed) {
                near.add(new Near(name, d));
            }
        }
        near.sort(Comparator.comparingInt(Near::distance));
        return near.stream().map(Near::name).limit(5).toList();
    }
}

package org.spectralsieve.requirement;

import java.util.ArrayList;
import java.util.List;
import org.spectralsieve.requirement.Token.Kind;

/**
 * Splits a requirement text into tokens. Letters and digits split from each other ("365nm" is a number
 * and a word) so that users need not space units; every other character is either a symbol the language
 * knows or an error at its position.
 */
final class Tokenizer {

    private final String text;
    private final List<Token> tokens = new ArrayList<>();
    private int pos;

    private Tokenizer(String text) {
        this.text = text;
    }

    /** The tokens of {@code text}, always ending with one {@link Kind#END} token at the text's length. */
    static List<Token> tokenize(String text) {
        Tokenizer tokenizer = new Tokenizer(text);
        tokenizer.run();
        return List.copyOf(tokenizer.tokens);
    }

    private void run() {
        while (pos < text.length()) {
            int c = text.codePointAt(pos);
            if (Character.isWhitespace(c) || Character.isSpaceChar(c)) {
                pos += Character.charCount(c);
            } else if (isAsciiDigit(c) || (c == '.' && isAsciiDigit(charAt(pos + 1)))) {
                number();
            } else if (Character.isLetter(c)) {
                word();
            } else {
                symbol(c);
            }
        }
        tokens.add(new Token(Kind.END, "", text.length(), text.length()));
    }

    private void number() {
        int start = pos;
        while (isAsciiDigit(charAt(pos))) {
            pos++;
        }
        if (charAt(pos) == '.' && isAsciiDigit(charAt(pos + 1))) {
            pos++;
            while (isAsciiDigit(charAt(pos))) {
                pos++;
            }
        }
        add(Kind.NUMBER, start);
    }

    private void word() {
        int start = pos;
        while (pos < text.length()) {
            int c = text.codePointAt(pos);
            if (Character.isLetter(c)) {
                pos += Character.charCount(c);
            } else if (c == '-' && pos + 1 < text.length() && Character.isLetter(text.codePointAt(pos + 1))) {
                pos++; // an inner hyphen keeps "cut-off" and "resin-tank" one word
            } else {
                break;
            }
        }
        // the one unit with a slash: "J/cm²" (or "J/cm2") is one word, a dose
        if (pos - start == 1 && (text.charAt(start) == 'J' || text.charAt(start) == 'j')
                && text.startsWith("/cm", pos) && (charAt(pos + 3) == '²' || charAt(pos + 3) == '2')) {
            pos += 4;
        }
        add(Kind.WORD, start);
    }

    private void symbol(int c) {
        int start = pos;
        switch (c) {
            case '%' -> single(Kind.PERCENT);
            case ',' -> single(Kind.COMMA);
            case '-', '–' -> single(Kind.DASH);
            case '≥' -> single(Kind.AT_LEAST);
            case '°' -> single(Kind.WORD); // the degree sign is a unit word: "30°"
            case '≤' -> single(Kind.AT_MOST);
            case '>', '<' -> {
                pos += charAt(pos + 1) == '=' ? 2 : 1;
                add(c == '>' ? Kind.AT_LEAST : Kind.AT_MOST, start);
            }
            default -> {
                String ch = new String(Character.toChars(c));
                throw new RequirementSyntaxException(start,
                        "a word, a number, '%', ',', '-' or a comparison such as '>='",
                        "'" + ch + "' (U+" + String.format("%04X", c) + ")", null);
            }
        }
    }

    private void single(Kind kind) {
        pos++;
        add(kind, pos - 1);
    }

    private void add(Kind kind, int start) {
        tokens.add(new Token(kind, text.substring(start, pos), start, pos));
    }

    private int charAt(int index) {
        return index < text.length() ? text.charAt(index) : -1;
    }

    private static boolean isAsciiDigit(int c) {
        return c >= '0' && c <= '9';
    }
}

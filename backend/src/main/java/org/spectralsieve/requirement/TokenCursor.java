package org.spectralsieve.requirement;

import java.math.BigDecimal;
import java.util.List;
import java.util.function.Supplier;
import org.spectralsieve.requirement.Token.Kind;

/** Reading position in a token list, with the checks and error construction every rule needs. */
final class TokenCursor {

    private final String text;
    private final List<Token> tokens;
    private int index;

    TokenCursor(String text) {
        this.text = text;
        this.tokens = Tokenizer.tokenize(text);
    }

    Token peek() {
        return tokens.get(index);
    }

    Token peek(int ahead) {
        return tokens.get(Math.min(index + ahead, tokens.size() - 1));
    }

    Token next() {
        Token token = tokens.get(index);
        if (token.kind() != Kind.END) {
            index++;
        }
        return token;
    }

    /** The token just consumed; its end marks where a clause stops. */
    Token previous() {
        return tokens.get(Math.max(index - 1, 0));
    }

    boolean atWord(String keyword) {
        return peek().isWord(keyword);
    }

    boolean at(Kind kind) {
        return peek().kind() == kind;
    }

    /** Consumes the word if it is next. */
    boolean acceptWord(String keyword) {
        if (atWord(keyword)) {
            index++;
            return true;
        }
        return false;
    }

    Token expectWord(Expected expected, String... keywords) {
        for (String keyword : keywords) {
            if (atWord(keyword)) {
                return next();
            }
        }
        throw error(expected);
    }

    Token expect(Kind kind, Expected expected) {
        if (!at(kind)) {
            throw error(expected);
        }
        return next();
    }

    /** The next token as a decimal number; BigDecimal keeps "0.365 µm" and "80%" exact when scaled. */
    BigDecimal expectNumber(Expected expected) {
        return new BigDecimal(expect(Kind.NUMBER, expected).text());
    }

    String slice(int start, int end) {
        return text.substring(start, end).strip();
    }

    String text() {
        return text;
    }

    RequirementSyntaxException error(Expected expected) {
        Token found = peek();
        return new RequirementSyntaxException(found.start(), expected.describe(), found.quoted(),
                expected.suggestionFor(found));
    }

    /**
     * Builds a model record. The parser checks every value before this point; should a record still refuse
     * one, the caller gets the syntax exception the parser promises rather than a bare
     * IllegalArgumentException.
     */
    static <T> T build(Token at, Supplier<T> constructor) {
        try {
            return constructor.get();
        } catch (RequirementTooLargeException e) {
            throw e; // a bound on the whole requirement, not a value at this token
        } catch (IllegalArgumentException e) {
            throw new RequirementSyntaxException(at.start(), "values the requirement model accepts", "'"
                    + e.getMessage() + "'", null);
        }
    }

    /** A well-formed value out of its range, reported at the token that carries it. */
    static RequirementSyntaxException outOfRange(Token at, String expected, String found) {
        return new RequirementSyntaxException(at.start(), expected, found, null);
    }
}

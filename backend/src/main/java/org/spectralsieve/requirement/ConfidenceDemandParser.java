package org.spectralsieve.requirement;

import java.math.BigDecimal;
import org.spectralsieve.requirement.Token.Kind;

/**
 * "… with 95% confidence" at the end of a transmittance clause:
 * <pre>
 * demand = "with" number "%" "confidence"
 * </pre>
 * The number is a percentage from 50 to 99.9 (why those ends: {@link TransmittanceClause}). Cutoff, weighted
 * and critical-wavelength clauses have no computed confidence ({@link ClauseConfidence}), so a demand after
 * one is refused rather than left to make every row unverified.
 */
final class ConfidenceDemandParser {

    private static final BigDecimal HUNDRED = BigDecimal.valueOf(100);

    private ConfidenceDemandParser() {
    }

    /** The clause, with the demand that follows it if any; {@code start} is the clause's first token. */
    static Clause attach(TokenCursor in, Clause clause, Token start) {
        if (!in.atWord("with")) {
            return clause;
        }
        Token with = in.next();
        if (!(clause instanceof TransmittanceClause t)) {
            throw TokenCursor.outOfRange(with, "',', 'and' or end of text (a confidence can be asked only of a"
                    + " transmittance clause: cutoffs and weighted figures have no computed confidence)", with.quoted());
        }
        Token number = in.peek();
        BigDecimal percent = in.expectNumber(Expected.described("a confidence such as '95%'").after("with"));
        in.expect(Kind.PERCENT, Expected.described("'%' (a confidence is a percentage, e.g. '95%')")
                .after(number.text()));
        in.expectWord(Expected.keywords("confidence").after(number.text() + "%"), "confidence");
        double fraction = percent.divide(HUNDRED).doubleValue();
        if (!TransmittanceClause.allowedDemand(fraction)) {
            throw TokenCursor.outOfRange(number, "a confidence from 50% to 99.9% (under 50% a reading that misses"
                    + " could still satisfy it; over 99.9% rests on the far tail of the error model)", number.quoted() + "%");
        }
        String text = in.slice(start.start(), in.previous().end());
        return TokenCursor.build(start, () -> t.withConfidenceDemand(fraction, text));
    }

    /** " with 95% confidence" as the renderer writes it, empty without a demand. */
    static String render(TransmittanceClause clause) {
        if (clause.confidenceDemand().isEmpty()) {
            return "";
        }
        return " with " + BigDecimal.valueOf(clause.confidenceDemand().getAsDouble()).movePointRight(2)
                .stripTrailingZeros().toPlainString() + "% confidence";
    }
}

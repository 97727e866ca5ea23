package org.spectralsieve.requirement;

import java.math.BigDecimal;
import org.spectralsieve.requirement.Token.Kind;
import org.spectralsieve.states.StateKind;

/**
 * Clauses naming a material state, and levels relative to the same candidate (docs/requirement-language.md,
 * "States and relative levels").
 *
 * <pre>
 * stated    = state ( spectral | relative )        ("after 1000 h passes over 80% at 365 nm")
 * state     = "after" number ( "h" | "hours" | "hour" ) | "after" number "J/cm²" "at" wavelength
 *           | "printed" [ "black" ] | "base" | "new" | "unprinted" | "as" "supplied"
 * relative  = band comparison share "of" "its" wavelength "value"          ("at 380 nm under 1% of its 550 nm value")
 *           | band [ "the" ] state comparison share "of" [ "the" ] state   ("from 350 to 420 nm the printed black under 0.1% of the base")
 * share     = number "%" | number (a fraction up to 1) | "half"
 * </pre>
 * "under"/"below"/"at most" keep the ratio at most the share (a block), "over"/"above"/"at least" at least it. A
 * clause on the as-supplied state is the plain clause itself (the sample's own curve), with the words kept.
 */
final class StateClauseParser {

    private final TokenCursor in;
    private final SpectralClauseParser spectral;

    StateClauseParser(TokenCursor in, SpectralClauseParser spectral) {
        this.in = in;
        this.spectral = spectral;
    }

    /** Whether the tokens ahead start a state ("after 1000 h", "printed black", "base", "as supplied"). */
    boolean atState() {
        Token t = in.peek();
        return t.isWord("after") && in.peek(1).kind() == Kind.NUMBER
                || t.isWord("printed") || t.isWord("base") || t.isWord("new") || t.isWord("unprinted")
                || t.isWord("as") && in.peek(1).isWord("supplied");
    }

    /** Whether "at"/"from"/"between" here starts a relative clause: a wavelength band, then a comparison or a state. */
    boolean atRelative() {
        Token t = in.peek();
        if (t.isWord("at")) {
            return in.peek(1).kind() == Kind.NUMBER && SpectralClauseParser.isWavelengthUnit(in.peek(2));
        }
        return t.isWord("from") || t.isWord("between");
    }

    StateAsked state() {
        Token first = in.next();
        switch (first.lower()) {
            case "printed" -> {
                in.acceptWord("black");
                return StateAsked.PRINTED;
            }
            case "base", "new", "unprinted" -> {
                return StateAsked.AS_SUPPLIED;
            }
            case "as" -> {
                in.next(); // "supplied"
                return StateAsked.AS_SUPPLIED;
            }
            default -> {
                return exposure(first);
            }
        }
    }

    /** "after 1000 h", "after 50 J/cm² at 365 nm"; "after" is consumed. */
    private StateAsked exposure(Token after) {
        Token number = in.peek();
        BigDecimal value = in.expectNumber(Expected.described("an exposure such as '1000 h' or '50 J/cm² at 365 nm'")
                .after(after.text()));
        Token unit = in.expectWord(Expected.keywords("h", "hours", "J/cm²").after(number.text()),
                "h", "hours", "hour", "hrs", "j/cm²", "j/cm2");
        if (unit.lower().startsWith("j")) {
            in.expectWord(Expected.keywords("at").because("after a dose: the wavelength it was given at, as in"
                    + " 'after 50 J/cm² at 365 nm'"), "at");
            double nm = SpectralClauseParser.nanometres(spectral.wavelength(true), null);
            return TokenCursor.build(number, () -> StateAsked.afterDose(value.doubleValue(), nm));
        }
        return TokenCursor.build(number, () -> StateAsked.afterHours(value.doubleValue()));
    }

    /** A clause after a state: a spectral clause read on that state's curve, or a relative one. */
    Clause stated(Token start, StateAsked state, Clause inner) {
        String text = in.slice(start.start(), in.previous().end());
        if (inner instanceof RelativeClause r) {
            // read with the state already (relative(start, state)): only the text grows to the clause's start
            return TokenCursor.build(start, () -> new RelativeClause(r.direction(), r.band(), r.fraction(),
                    r.referenceNm(), r.state(), r.referenceState(), text));
        }
        if (inner instanceof StateClause) {
            throw new RequirementSyntaxException(start.start(), "one state per clause", "two, in '" + text + "'", null);
        }
        if (state.kind() == StateKind.AS_SUPPLIED) {
            // the sample's own curve: the plain clause, keeping the words the user wrote
            return inner instanceof TransmittanceClause t ? new TransmittanceClause(t.direction(), t.aggregate(),
                    t.band(), t.thresholdT(), t.unit(), text, t.confidenceDemand()) : inner;
        }
        return TokenCursor.build(start, () -> new StateClause(state, inner, text));
    }

    /** "at 380 nm under 1% of its 550 nm value", "from 350 to 420 nm the printed black under 0.1% of the base". */
    RelativeClause relative(Token start) {
        return relative(start, null);
    }

    /**
     * @param before the state written before the band ("printed black from 350 to 420 nm under 0.1% of the base"),
     *               or null
     */
    RelativeClause relative(Token start, StateAsked before) {
        Band band = spectral.band(false, "");
        in.acceptWord("the");
        boolean inside = atState();
        if (inside && before != null) {
            throw in.error(Expected.keywords("under", "over").because("(the state is named before the band already)"));
        }
        StateAsked numerator = inside ? state() : before;
        Token comparison = in.peek();
        SpectralClauseParser.Sense sense = spectral.comparisonWord(comparison);
        if (sense == null && numerator == null && !in.atWord("of")) {
            // "at 365 nm" alone: most likely a plain clause with its level forgotten
            throw new RequirementSyntaxException(start.start(), "a level such as 'passes over 80%' before the wavelength"
                    + (in.at(Kind.END) || in.at(Kind.COMMA) || in.atWord("and") ? ""
                    : ", or after it one relative to another value: 'under 1% of its 550 nm value'"),
                    "'" + in.slice(start.start(), in.previous().end()) + "'", null);
        }
        if (sense == null) {
            throw in.error(Expected.keywords("under", "over", "at most", "at least")
                    .because("after the band: a level such as 'under 1% of its 550 nm value'"
                            + " (or put the verb first: 'passes over 80% " + in.slice(start.start(),
                            in.previous().end()) + "')"));
        }
        double share = share();
        in.expectWord(Expected.keywords("of").after("the level"), "of");
        Direction direction = sense == SpectralClauseParser.Sense.HIGHER ? Direction.PASS : Direction.BLOCK;
        if (in.acceptWord("its")) {
            if (inside) {
                throw in.error(Expected.keywords("the").because("(a state before the level compares two states:"
                        + " 'of the base')"));
            }
            double nm = SpectralClauseParser.nanometres(spectral.wavelength(true), null);
            in.expectWord(Expected.keywords("value").after("nm"), "value");
            String text = in.slice(start.start(), in.previous().end());
            StateAsked own = numerator == null ? StateAsked.AS_SUPPLIED : numerator;
            return TokenCursor.build(start, () -> new RelativeClause(direction, band, share, nm, own, own, text));
        }
        in.acceptWord("the");
        if (!atState()) {
            throw in.error(Expected.keywords("its", "the base", "the printed black", "after")
                    .because("after 'of': its own value at a wavelength, or another state's curve"));
        }
        StateAsked reference = state();
        StateAsked top = numerator == null ? StateAsked.AS_SUPPLIED : numerator;
        String text = in.slice(start.start(), in.previous().end());
        return TokenCursor.build(start, () -> new RelativeClause(direction, band, share, Double.NaN, top,
                reference, text));
    }

    /** "1%", "0.5", "half": the share of the reference, above 0 and at most 1. */
    private double share() {
        if (in.acceptWord("half")) {
            return 0.5;
        }
        Token number = in.peek();
        BigDecimal value = in.expectNumber(Expected.described("a share such as '1%' or 'half'").after("the comparison"));
        boolean percent = in.at(Kind.PERCENT);
        if (percent) {
            in.next();
        }
        double share = percent ? value.movePointLeft(2).doubleValue() : value.doubleValue();
        if (!(share > 0 && share <= 1)) {
            throw TokenCursor.outOfRange(number, percent ? "a share above 0 and at most 100%"
                    : "a fraction above 0 and at most 1 (or a percentage with '%')", number.quoted());
        }
        return share;
    }
}

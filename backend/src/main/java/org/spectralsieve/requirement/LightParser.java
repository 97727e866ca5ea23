package org.spectralsieve.requirement;

import java.math.BigDecimal;
import org.spectralsieve.optics.Illumination;
import org.spectralsieve.requirement.Token.Kind;

/**
 * Reads how the light meets the path ({@link Illumination}), one statement per requirement:
 * <ul>
 *   <li>"at 30° incidence" (also "at 30 deg incidence", "at 30 degrees incidence"); "at normal incidence";</li>
 *   <li>"over a 60° beam": a uniform beam of that full angle (±30°);</li>
 *   <li>"under an LED with 120° beam angle": cos^m θ with half intensity at half that angle;</li>
 *   <li>"under a Lambertian source": cos θ over the hemisphere.</li>
 * </ul>
 * "over" and "under" also begin a level ("over 80% at 365 nm"); an article after them ("over a", "under an")
 * marks the light, which a level never has.
 */
final class LightParser {

    private static final String EXAMPLES = "'at 30° incidence', 'over a 60° beam', 'under an LED with 120° beam angle'"
            + " or 'under a Lambertian source'";

    private final TokenCursor in;

    LightParser(TokenCursor in) {
        this.in = in;
    }

    /** Whether the cursor stands on a light statement. */
    boolean atLight() {
        Token first = in.peek();
        if (first.isWord("at")) {
            return in.peek(1).isWord("normal") && in.peek(2).isWord("incidence")
                    || in.peek(1).kind() == Kind.NUMBER && isDegree(in.peek(2));
        }
        return (first.isWord("over") || first.isWord("under")) && (in.peek(1).isWord("a") || in.peek(1).isWord("an"));
    }

    /** Reads the statement {@link #atLight} found. */
    Illumination light() {
        Token first = in.next();
        if (first.isWord("at")) {
            if (in.acceptWord("normal")) {
                in.expectWord(Expected.keywords("incidence").after("normal"), "incidence");
                return Illumination.NORMAL;
            }
            Token number = in.peek();
            double deg = degrees(Expected.described("an angle such as 30°").after("at"));
            in.expectWord(Expected.keywords("incidence").after(in.previous().text()), "incidence");
            if (!(deg <= Illumination.MAX_INCIDENCE_DEG)) {
                throw TokenCursor.outOfRange(number, "an angle of incidence from 0° to "
                        + (int) Illumination.MAX_INCIDENCE_DEG + "° (at 90° no light enters)", "'" + number.text() + "°'");
            }
            return Illumination.atIncidence(deg);
        }
        in.next(); // the article
        if (first.isWord("over")) {
            Token number = in.peek();
            double full = degrees(Expected.described("a beam's full angle such as 60°").after(first.text() + " a"));
            in.expectWord(Expected.keywords("beam").after(in.previous().text()), "beam");
            if (!(full > 0 && full <= 180)) {
                throw TokenCursor.outOfRange(number, "a beam's full angle above 0° and at most 180°",
                        "'" + number.text() + "°'");
            }
            return Illumination.beam(full);
        }
        if (in.acceptWord("lambertian")) {
            in.expectWord(Expected.keywords("source", "emitter").after("Lambertian"), "source", "emitter");
            return Illumination.lambertian();
        }
        in.expectWord(Expected.keywords("LED", "Lambertian").after(first.text() + " " + in.previous().text()), "led");
        in.expectWord(Expected.keywords("with").after("LED"), "with");
        Token number = in.peek();
        double full = degrees(Expected.described("a beam angle such as 120°").after("with"));
        in.expectWord(Expected.keywords("beam").after(in.previous().text()), "beam");
        in.expectWord(Expected.keywords("angle").after("beam"), "angle");
        if (!(full > 0 && full <= 2 * Illumination.MAX_INCIDENCE_DEG)) {
            throw TokenCursor.outOfRange(number, "an LED beam angle above 0° and at most "
                    + (int) (2 * Illumination.MAX_INCIDENCE_DEG) + "°", "'" + number.text() + "°'");
        }
        return Illumination.led(full);
    }

    /** A number followed by °, "deg" or "degrees". */
    private double degrees(Expected expected) {
        BigDecimal value = in.expectNumber(expected);
        Token unit = in.peek();
        if (!isDegree(unit)) {
            throw in.error(Expected.keywords("°", "deg", "degrees").after(in.previous().text()));
        }
        in.next();
        return value.doubleValue();
    }

    private static boolean isDegree(Token t) {
        return t.isWord("°") || t.isWord("deg") || t.isWord("degrees") || t.isWord("degree");
    }

    /** What a second light statement is told. */
    static String examples() {
        return EXAMPLES;
    }
}

package org.spectralsieve.importers.jcamp;

import static org.assertj.core.api.Assertions.assertThat;

import org.junit.jupiter.api.Test;
import org.spectralsieve.importers.ImportException;

/**
 * Hand-made lines for each ASDF form, worked out by hand from the character tables of JCAMP-DX 4.24
 * (McDonald &amp; Wilks 1988, Appl. Spectrosc. 42:151, table of pseudo-digits): SQZ @=0, A–I=1–9,
 * a–i=−1…−9; DIF %=0, J–R=1–9, j–r=−1…−9; DUP S–Z=1–8, s=9 (the count includes the original).
 */
class AsdfDecodingTest {

    @Test
    void squeezedDigitsCarrySignAndFirstDigit() throws ImportException {
        // @ = 0; A1 = +11; a1 = −11; I9 = +99; i9 = −99; a0247 = −10247
        assertThat(Jdx.rawY(Jdx.xydata(1, 6, 6, "1 @A1a1I9i9a0247"))).containsExactly(0, 11, -11, 99, -99, -10247);
    }

    @Test
    void differencesAccumulateAndTheNextLineRepeatsTheLastOrdinateAsAYCheck() throws ImportException {
        // line 1: A0 = 10; J5 = +15 → 25; j2 = −12 → 13; % = +0 → 13 (ends in DIF form)
        // line 2: A3 = 13 is the Y-check (the same point as the last of line 1, kept once); J = +1 → 14
        assertThat(Jdx.rawY(Jdx.xydata(1, 5, 5, "1 A0J5j2%", "4 A3J"))).containsExactly(10, 25, 13, 13, 14);
    }

    @Test
    void aLineHoldingOnlyTheYCheckAddsNoPoint() throws ImportException {
        // line 1: A0 = 10, J0 = +10 → 20 (DIF form); line 2 "2 B0": only the check value 20, at x = 2
        assertThat(Jdx.rawY(Jdx.xydata(1, 2, 2, "1 A0J0", "2 B0"))).containsExactly(10, 20);
    }

    @Test
    void duplicateRepeatsAValueOrADifference() throws ImportException {
        // A0T: 10 twice. A0J1U: 10, +11 → 21, U = 3 in all → two more +11 → 32, 43. @s: nine zeros.
        assertThat(Jdx.rawY(Jdx.xydata(1, 2, 2, "1 A0T"))).containsExactly(10, 10);
        assertThat(Jdx.rawY(Jdx.xydata(1, 4, 4, "1 A0J1U"))).containsExactly(10, 21, 32, 43);
        assertThat(Jdx.rawY(Jdx.xydata(1, 9, 9, "1 @s"))).containsExactly(0, 0, 0, 0, 0, 0, 0, 0, 0);
    }

    @Test
    void duplicateCountMayHaveSeveralDigits() throws ImportException {
        // S0 = 10 in all: ten copies of A = 1
        assertThat(Jdx.rawY(Jdx.xydata(1, 10, 10, "1 AS0"))).containsExactly(1, 1, 1, 1, 1, 1, 1, 1, 1, 1);
    }

    @Test
    void packedValuesAreSeparatedByTheirSigns() throws ImportException {
        // PAC: "+10-20+30 40" is four absolute values
        assertThat(Jdx.rawY(Jdx.xydata(1, 4, 4, "1+10-20+30 40"))).containsExactly(10, -20, 30, 40);
    }

    @Test
    void affnTakesDecimalsAndSignedExponents() throws ImportException {
        // 1.5; −2.25E+01 = −22.5; .5 = 0.5
        assertThat(Jdx.rawY(Jdx.xydata(1, 3, 3, "1 1.5 -2.25E+01 .5"))).containsExactly(1.5, -22.5, 0.5);
    }

    @Test
    void aBareEAfterTheAbscissaIsASqueezedDigitNotAnExponent() throws ImportException {
        // "2E5" is X = 2 then SQZ E5 = +55 (a signed exponent would be written 2E+5)
        assertThat(Jdx.rawY(Jdx.xydata(2, 3, 2, "2E5F6"))).containsExactly(55, 66);
    }

    @Test
    void formsMixOnOneLineAndAcrossLines() throws ImportException {
        // line 1 SQZ+DIF+DUP: A0 = 10, J = +1 → 11, T → 12; line 2 Y-check A2 = 12, then PAC +5 -5
        assertThat(Jdx.rawY(Jdx.xydata(1, 5, 5, "1A0JT", "3A2+5-5"))).containsExactly(10, 11, 12, 5, -5);
    }

    @Test
    void commentsBlankLinesAndSeparatorsInsideDataAreSkipped() throws ImportException {
        assertThat(Jdx.rawY(Jdx.xydata(1, 4, 4, "$$ a whole-line comment", "1 10,20;30 $$ trailing", "",
                "4 40"))).containsExactly(10, 20, 30, 40);
    }
}

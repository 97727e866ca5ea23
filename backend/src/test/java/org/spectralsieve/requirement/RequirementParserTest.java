package org.spectralsieve.requirement;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;
import static org.assertj.core.api.Assertions.catchThrowable;
import static org.spectralsieve.requirement.Aggregate.EVERY_POINT;
import static org.spectralsieve.requirement.Aggregate.MEAN;
import static org.spectralsieve.requirement.Direction.BLOCK;
import static org.spectralsieve.requirement.Direction.PASS;
import static org.spectralsieve.requirement.ThresholdUnit.FRACTION;
import static org.spectralsieve.requirement.ThresholdUnit.OPTICAL_DENSITY;
import static org.spectralsieve.requirement.ThresholdUnit.PERCENT;

import java.util.List;
import java.util.Optional;
import java.util.Random;
import java.util.stream.Stream;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.Arguments;
import org.junit.jupiter.params.provider.CsvSource;
import org.junit.jupiter.params.provider.MethodSource;

/**
 * The requirement language. Example wordings follow the trade's presets as users say them (common
 * practice, no source); the OD figures use the definition OD = -log10 T (ANSI Z80.3-2001 §3.2), so
 * OD 3 is T = 0.001 and OD 4 is T = 0.0001.
 */
class RequirementParserTest {

    // ---- fixtures: expected records, with empty texts (texts are checked separately) ----

    private static TransmittanceClause t(Direction d, Aggregate a, Band band, double threshold, ThresholdUnit unit) {
        return new TransmittanceClause(d, a, band, threshold, unit, "");
    }

    private static CutoffClause cutoff(double level, double fromNm, double toNm) {
        return new CutoffClause(level, new Band(fromNm, toNm), "");
    }

    private static Requirement req(Clause... clauses) {
        return new Requirement(List.of(clauses), ThicknessSpec.AS_MEASURED, Optional.empty(), Optional.empty(), "");
    }

    private static Requirement req(ThicknessSpec thickness, String materialClass, String geometry, Clause... clauses) {
        return new Requirement(List.of(clauses), thickness, Optional.ofNullable(materialClass),
                Optional.ofNullable(geometry), "");
    }

    /** The requirement with every text field emptied, so records compare on meaning alone. */
    static Requirement withoutTexts(Requirement r) {
        List<Clause> clauses = r.clauses().stream().map(RequirementParserTest::withoutText).toList();
        return new Requirement(clauses, r.thickness(), r.materialClass(), r.geometry(),
                r.layer().map(l -> new FixedLayer(l.placement(), l.thicknessMm(), l.material(), "")), "");
    }

    private static Clause withoutText(Clause c) {
        if (c instanceof TransmittanceClause t) {
            return new TransmittanceClause(t.direction(), t.aggregate(), t.band(), t.thresholdT(), t.unit(), "");
        }
        if (c instanceof WeightedClause w) {
            return new WeightedClause(w.direction(), w.thresholdT(), w.unit(), w.weighting(), "");
        }
        if (c instanceof CriticalWavelengthClause k) {
            return new CriticalWavelengthClause(k.comparison(), k.nm(), "");
        }
        return new CutoffClause(((CutoffClause) c).levelT(), ((CutoffClause) c).window(), "");
    }

    static Stream<Arguments> validRequirements() {
        return Stream.of(
                Arguments.of("passes over 80% at 365 nm and blocks under 1% at 405 nm",
                        req(t(PASS, EVERY_POINT, Band.at(365), 0.80, PERCENT), t(BLOCK, EVERY_POINT, Band.at(405), 0.01, PERCENT))),
                Arguments.of("passes at least 90% from 350 to 400 nm", req(t(PASS, EVERY_POINT, new Band(350, 400), 0.90, PERCENT))),
                Arguments.of("mean over 85% from 360 to 370 nm", req(t(PASS, MEAN, new Band(360, 370), 0.85, PERCENT))),
                Arguments.of("mean under 5% from 280 to 315 nm", req(t(BLOCK, MEAN, new Band(280, 315), 0.05, PERCENT))),
                Arguments.of("blocks under 0.1% from 250 to 320 nm", req(t(BLOCK, EVERY_POINT, new Band(250, 320), 0.001, PERCENT))),
                Arguments.of("OD 3 or more at 405 nm", req(t(BLOCK, EVERY_POINT, Band.at(405), 0.001, OPTICAL_DENSITY))),
                Arguments.of("OD at least 4 from 190 to 315 nm", req(t(BLOCK, EVERY_POINT, new Band(190, 315), 0.0001, OPTICAL_DENSITY))),
                Arguments.of("OD 3 at 405 nm", req(t(BLOCK, EVERY_POINT, Band.at(405), 0.001, OPTICAL_DENSITY))),
                Arguments.of("blocks to OD 5 or more at 405 nm", req(t(BLOCK, EVERY_POINT, Band.at(405), 0.00001, OPTICAL_DENSITY))),
                Arguments.of("blocks to OD 4 from 350 to 420 nm and passes over 50% at 550 nm",
                        req(t(BLOCK, EVERY_POINT, new Band(350, 420), 0.0001, OPTICAL_DENSITY), t(PASS, EVERY_POINT, Band.at(550), 0.5, PERCENT))),
                Arguments.of("mean OD over 3 from 380 to 420 nm", req(t(BLOCK, MEAN, new Band(380, 420), 0.001, OPTICAL_DENSITY))),
                Arguments.of("OD at most 0.1 at 365 nm", req(t(PASS, EVERY_POINT, Band.at(365), Math.pow(10, -0.1), OPTICAL_DENSITY))),
                Arguments.of("cutoff between 380 and 395 nm", req(cutoff(0.5, 380, 395))),
                Arguments.of("10% cutoff between 380 and 395 nm", req(cutoff(0.10, 380, 395))),
                Arguments.of("cutoff at 1% from 380 to 395 nm", req(cutoff(0.01, 380, 395))),
                Arguments.of("Cut-off at 50% between 380 and 395 nm", req(cutoff(0.5, 380, 395))),
                Arguments.of("passes over 85% from 380 to 410 nm, thickness 1 to 6 mm",
                        req(ThicknessSpec.range(1, 6), null, null, t(PASS, EVERY_POINT, new Band(380, 410), 0.85, PERCENT))),
                Arguments.of("passes over 80% at 254 nm, at 3 mm",
                        req(ThicknessSpec.at(3), null, null, t(PASS, EVERY_POINT, Band.at(254), 0.80, PERCENT))),
                Arguments.of("thickness 2.5 mm and passes over 80% at 254 nm",
                        req(ThicknessSpec.at(2.5), null, null, t(PASS, EVERY_POINT, Band.at(254), 0.80, PERCENT))),
                Arguments.of("passes over 80% at 365 nm, class plastic sheet, geometry regular",
                        req(ThicknessSpec.AS_MEASURED, "plastic sheet", "regular", t(PASS, EVERY_POINT, Band.at(365), 0.80, PERCENT))),
                Arguments.of("Material Class Resin-Tank Sheet and passes over 90% from 365 to 405 nm, geometry TOTAL",
                        req(ThicknessSpec.AS_MEASURED, "resin-tank sheet", "total", t(PASS, EVERY_POINT, new Band(365, 405), 0.90, PERCENT))),
                Arguments.of("passes over 0.8 at 0.365 µm", req(t(PASS, EVERY_POINT, Band.at(365), 0.8, FRACTION))),
                Arguments.of("passes above 80% at 0.365 um", req(t(PASS, EVERY_POINT, Band.at(365), 0.80, PERCENT))),
                Arguments.of("passes above 80% from 0.35 to 0.42 μm", req(t(PASS, EVERY_POINT, new Band(350, 420), 0.80, PERCENT))),
                Arguments.of("  PASSES   MORE THAN 80 %   AT 365NM  ", req(t(PASS, EVERY_POINT, Band.at(365), 0.80, PERCENT))),
                Arguments.of("passes >= 80% at 365 nm", req(t(PASS, EVERY_POINT, Band.at(365), 0.80, PERCENT))),
                Arguments.of("passes ≥ 80% at 365 nm", req(t(PASS, EVERY_POINT, Band.at(365), 0.80, PERCENT))),
                Arguments.of("passes 80% or more at 365 nm", req(t(PASS, EVERY_POINT, Band.at(365), 0.80, PERCENT))),
                Arguments.of("passes 80% at 365 nm", req(t(PASS, EVERY_POINT, Band.at(365), 0.80, PERCENT))),
                Arguments.of("blocks below 1% at 405 nm", req(t(BLOCK, EVERY_POINT, Band.at(405), 0.01, PERCENT))),
                Arguments.of("blocks less than 1% at 405 nm", req(t(BLOCK, EVERY_POINT, Band.at(405), 0.01, PERCENT))),
                Arguments.of("blocks at most 1% at 405 nm", req(t(BLOCK, EVERY_POINT, Band.at(405), 0.01, PERCENT))),
                Arguments.of("blocks <= 1% at 405 nm", req(t(BLOCK, EVERY_POINT, Band.at(405), 0.01, PERCENT))),
                Arguments.of("blocks 1% or less at 405 nm", req(t(BLOCK, EVERY_POINT, Band.at(405), 0.01, PERCENT))),
                Arguments.of("passes over 80% at 300 nm and over 90% at 400 nm",
                        req(t(PASS, EVERY_POINT, Band.at(300), 0.80, PERCENT), t(PASS, EVERY_POINT, Band.at(400), 0.90, PERCENT))),
                Arguments.of("blocks under 1% from 300 to 500 nm, and passes over 20% at 600 nm",
                        req(t(BLOCK, EVERY_POINT, new Band(300, 500), 0.01, PERCENT), t(PASS, EVERY_POINT, Band.at(600), 0.20, PERCENT))),
                Arguments.of("passes over 85% between 380 and 410 nm", req(t(PASS, EVERY_POINT, new Band(380, 410), 0.85, PERCENT))),
                Arguments.of("passes over 85% from 380-410 nm", req(t(PASS, EVERY_POINT, new Band(380, 410), 0.85, PERCENT))),
                Arguments.of("passes over 85% from 380 nm to 410 nm", req(t(PASS, EVERY_POINT, new Band(380, 410), 0.85, PERCENT))),
                Arguments.of("blocks under 0.1% from 390 to 525 nm, thickness as measured",
                        req(t(BLOCK, EVERY_POINT, new Band(390, 525), 0.001, PERCENT))),
                Arguments.of("passes over 90% from 365 to 405 nm, cutoff at 10% between 300 and 340 nm, thickness 0.05 to 0.25 mm, class film",
                        req(ThicknessSpec.range(0.05, 0.25), "film", null, t(PASS, EVERY_POINT, new Band(365, 405), 0.90, PERCENT),
                                cutoff(0.10, 300, 340))));
    }

    @ParameterizedTest(name = "{0}")
    @MethodSource("validRequirements")
    void readsEachWordingIntoTheExpectedRecords(String text, Requirement expected) {
        assertThat(withoutTexts(RequirementParser.parse(text))).isEqualTo(expected);
    }

    @ParameterizedTest(name = "{0}")
    @MethodSource("validRequirements")
    void canonicalRenderingReadsBackToTheSameRequirement(String text, Requirement expected) {
        Requirement parsed = RequirementParser.parse(text);
        String rendered = RequirementParser.render(parsed);
        assertThat(withoutTexts(RequirementParser.parse(rendered))).as(rendered).isEqualTo(withoutTexts(parsed));
    }

    @Test
    void renderingSpeaksTheModelsInclusiveThresholdsInTheUsersUnits() {
        Requirement r = RequirementParser.parse("passes over 80% at 365 nm and OD 3 or more from 380 to 420 nm, "
                + "mean under 0.05 from 280 to 315 nm, 10% cutoff between 380 and 395 nm, thickness 1 to 6 mm, "
                + "class plastic sheet, geometry regular");
        assertThat(RequirementParser.render(r)).isEqualTo("passes at least 80% at 365 nm and OD at least 3 from 380 to 420 nm"
                + " and mean at most 0.05 from 280 to 315 nm and cutoff at 10% between 380 and 395 nm, thickness 1 to 6 mm,"
                + " class plastic sheet, geometry regular");
    }

    @Test
    void densityOfThreeEqualsOneTenthOfAPercent() {
        // ANSI Z80.3-2001 §3.2: density = log10(1/T); OD 3 ↔ 0.1 %
        TransmittanceClause od = (TransmittanceClause) RequirementParser.parse("OD 3 at 405 nm").clauses().get(0);
        TransmittanceClause percent = (TransmittanceClause) RequirementParser.parse("blocks under 0.1% at 405 nm").clauses().get(0);
        assertThat(od.thresholdT()).isEqualTo(percent.thresholdT()).isEqualTo(0.001);
    }

    @Test
    void eachClauseQuotesItsOwnSliceOfTheText() {
        Requirement r = RequirementParser.parse("  passes over 80% at 365 nm and blocks under 1% at 405 nm ,  cutoff between 380 and 395 nm, at 3 mm ");
        assertThat(r.clauses()).extracting(Clause::text)
                .containsExactly("passes over 80% at 365 nm", "blocks under 1% at 405 nm", "cutoff between 380 and 395 nm");
        assertThat(r.text()).isEqualTo("passes over 80% at 365 nm and blocks under 1% at 405 nm ,  cutoff between 380 and 395 nm, at 3 mm");
    }

    // ---- malformed input: position, message fragment, suggestion ('-' for none) ----

    @ParameterizedTest(name = "[{0}]")
    @CsvSource(delimiter = '|', quoteCharacter = '"', textBlock = """
            blocks undr 1% at 405 nm                               | 7  | 'under', 'below', 'less than', 'at most'      | under
            pases over 80% at 365 nm                               | 0  | to start a clause                             | passes
            passes over 80% at 365                                 | 22 | 'nm', 'µm' or 'um' after '365', found end of text | -
            passes over 120% at 365 nm                             | 12 | a percentage above 0 and at most 100, found '120%' | -
            passes over 80% from 400 to 350 nm                     | 28 | a wavelength above 400 nm                     | -
            ""                                                     | 0  | a requirement such as                         | -
            "   "                                                  | 3  | a requirement such as                         | -
            and and                                                | 0  | to start a clause, found 'and'                | -
            passes over 80 at 365 nm                               | 12 | a fraction above 0 and at most 1              | 80%
            passes over 0% at 365 nm                               | 12 | a percentage above 0                          | -
            passes over 1.5 at 365 nm                              | 12 | a fraction above 0 and at most 1              | 1.5%
            passes over 80% at 50 nm                               | 19 | a wavelength from 100 to 3000 nm              | -
            passes over 80% at 3.65 µm                             | 19 | (3650 nm)                                     | -
            passes over 80% from 365 to 365 nm                     | 28 | a wavelength above 365 nm                     | -
            passes over 80% at 365 nm, thickness 0 mm              | 37 | a thickness above 0 and at most 1000 mm       | -
            passes over 80% at 365 nm, thickness 2000 mm           | 37 | a thickness above 0 and at most 1000 mm       | -
            passes over 80% at 365 nm, thickness 6 to 1 mm         | 42 | a thickness not below 6 mm                    | -
            passes over 80% at 365 nm, at 3 mm, thickness 1 to 6 mm | 36 | at most one thickness statement, found a second one after 'at 3 mm' | -
            passes over 80% at 365 nm, class film, class mask film | 39 | at most one class filter                      | -
            passes over 80% at 365 nm, geometry total, geometry regular | 43 | at most one geometry filter              | -
            at 3 mm                                                | 0  | a spectral clause such as 'passes             | -
            thickness 1 to 6 mm, class film                        | 0  | a spectral clause such as 'passes             | -
            passes under 5% at 365 nm                              | 7  | 'over', 'above', 'more than', 'at least' or '>=' after 'passes' | -
            mean over 85% at 365 nm                                | 14 | 'from' or 'between' (a mean needs a band of two wavelengths) | -
            blocks under 1% at 405 nm and                          | 29 | to start a clause, found end of text          | -
            passes over 80% at 365 nm blocks under 1% at 405 nm    | 26 | ',', 'and' or end of text after a clause      | -
            passes over 80% at 365 nm #                            | 26 | found '#' (U+0023)                            | -
            geometry diffuse, passes over 80% at 365 nm            | 9  | 'regular', 'total' or 'any' after 'geometry'  | -
            OD 12 at 405 nm                                        | 3  | an optical density above 0 and at most 10     | -
            thiknes 1 to 6 mm, passes over 80% at 365 nm           | 0  | to start a clause                             | thickness
            passes over 80% at 365 mn                              | 23 | 'nm', 'µm' or 'um'                            | nm
            cutoff at 100% between 380 and 395 nm                  | 10 | a cutoff level above 0 and below 100%         | -
            cutoff at 50% at 380 nm                                | 14 | 'from' or 'between' (after 'cutoff': a cutoff window needs two wavelengths) | -
            passes over 80% at 365 nm, blocks at 405 nm            | 34 | after 'blocks', found 'at'                    | -
            passes over 80% at 365 nm, class Plastic Sheet!        | 46 | found '!'                                     | -
            mean 85% from 360 to 370 nm                            | 5  | a comparison such as 'over' or 'under' before the number | -
            at 365 nm                                              | 0  | a level such as 'passes over 80%' before the wavelength | -
            passes over 80% at 365 nm, class                       | 32 | a class label such as 'plastic sheet'         | -
            blocks udner 1% at 405 nm                              | 7  | after 'blocks'                                | under
            passes over 80% frm 350 to 400 nm                      | 16 | 'at', 'from', 'between' or 'of'               | from
            OD at least 3 at 405 nm and passes OD 3 at 365 nm      | 35 | after 'passes … OD'                           | -
            """)
    void refusesMalformedTextAtThePositionOfTheProblem(String text, int position, String fragment, String suggestion) {
        Throwable thrown = catchThrowable(() -> RequirementParser.parse(text));
        assertThat(thrown).isInstanceOf(RequirementSyntaxException.class);
        RequirementSyntaxException e = (RequirementSyntaxException) thrown;
        assertThat(e.getMessage()).startsWith("at position " + position + ": expected ").contains(fragment);
        assertThat(e.position()).isEqualTo(position);
        assertThat(e.suggestion()).isEqualTo("-".equals(suggestion) ? Optional.empty() : Optional.of(suggestion));
    }

    @Test
    void misspeltComparisonGetsTheBriefsMessageShape() {
        assertThatThrownBy(() -> RequirementParser.parse("blocks undr 1% at 405 nm"))
                .isInstanceOf(RequirementSyntaxException.class)
                .hasMessage("at position 7: expected 'under', 'below', 'less than', 'at most', '<=', 'to OD', 'OD', 'mean'"
                        + " or a number after 'blocks', found 'undr' — did you mean 'under'?")
                .satisfies(e -> assertThat(((RequirementSyntaxException) e).expected())
                        .startsWith("'under', 'below'").endsWith("after 'blocks'"));
    }

    @Test
    void nullTextIsASyntaxErrorToo() {
        assertThatThrownBy(() -> RequirementParser.parse(null)).isInstanceOf(RequirementSyntaxException.class);
    }

    @ParameterizedTest(name = "{index}")
    @MethodSource("hostileInputs")
    void hostileInputOnlyEverRaisesSyntaxErrors(String text) {
        assertOnlySyntaxErrors(text);
    }

    static Stream<String> hostileInputs() {
        return Stream.of(
                "passes over 1" + "0".repeat(400) + "% at 365 nm",
                "passes over 80% at 1" + "0".repeat(400) + " nm",
                "passes over 0." + "0".repeat(400) + "1% at 365 nm",
                "OD " + "9".repeat(50) + " at 405 nm",
                "OD 0." + "0".repeat(50) + "1 at 405 nm",
                "passes over NaN% at 365 nm", "passes over Infinity at 365 nm", "passes over 1e3% at 365 nm",
                "passes over -5% at 365 nm", "passes over 80٪ at 365 nm", "passes over ٨٠% at ٣٦٥ nm",
                "passes over 80% at 365 nm 😀", "😀", "\u0000", "\uD800", "passes\tover\n80%\u00A0at 365 nm",
                "passes over 80% at 365 nm, thickness 1 to 1" + "0".repeat(400) + " mm",
                "passes over 80% at 365 nm, class " + "a".repeat(5000),
                "passes over 80% at 365 nm and ".repeat(400) + "blocks under 1% at 405 nm",
                "x".repeat(10_000), "1".repeat(10_000), "and ".repeat(2500), ",".repeat(10_000));
    }

    @Test
    void requirementLongerThanTheCapIsRefusedBeforeItIsRead() {
        // 10,015 characters of valid clauses: refused by length alone, naming both numbers
        String text = "passes over 80% at 365 nm and ".repeat(333) + "blocks under 1% at 405 nm";

        assertThatThrownBy(() -> RequirementParser.parse(text)).isInstanceOfSatisfying(RequirementTooLargeException.class,
                e -> {
                    assertThat(e.measure()).isEqualTo(RequirementTooLargeException.Measure.CHARACTERS);
                    assertThat(e.actual()).isEqualTo(text.length());
                    assertThat(e.limit()).isEqualTo(RequirementLimits.MAX_TEXT_LENGTH);
                });
    }

    @Test
    void requirementWithMoreClausesThanTheCapIsRefusedAndOneAtTheCapIsRead() {
        String clause = "passes over 80% at 365 nm and ";
        String atCap = clause.repeat(RequirementLimits.MAX_CLAUSES - 1) + "blocks under 1% at 405 nm";
        String overCap = clause.repeat(RequirementLimits.MAX_CLAUSES) + "blocks under 1% at 405 nm";
        assertThat(overCap.length()).isLessThanOrEqualTo(RequirementLimits.MAX_TEXT_LENGTH);

        assertThat(RequirementParser.parse(atCap).clauses()).hasSize(RequirementLimits.MAX_CLAUSES);
        assertThatThrownBy(() -> RequirementParser.parse(overCap)).isInstanceOfSatisfying(RequirementTooLargeException.class,
                e -> assertThat(e.actual()).isEqualTo(RequirementLimits.MAX_CLAUSES + 1));
    }

    @Test
    void twentyThousandRandomTextsOnlyEverRaiseSyntaxErrors() {
        String[] vocabulary = {"passes", "pass", "blocks", "mean", "OD", "od", "over", "under", "above", "below",
                "more", "less", "than", "at", "least", "most", "or", "to", "from", "between", "and", ",", "%", "-",
                ">=", "<=", "≥", "cutoff", "cut-off", "thickness", "as", "measured", "mm", "nm", "µm", "um",
                "class", "material", "plastic", "sheet", "geometry", "regular", "total", "0", "0.5", "1", "3",
                "80", "100", "120", "365", "405", "0.365", "1e9", "99999999999999999999", ".",
                "of", "led", "led-365", "weighted", "by", "erythema", "erythemal", "uv", "hazard", "uv-hazard",
                "transmittance", "critical", "wavelength", "behind", "on", "float", "glass", "illuminant", "a",
                "transmits", "T", "t", ">", "<", "visible", "light", "vlt", "thick", "UV400", "UV", "400", "99", "99.9",
                "50", "of UV", "between 3 and 6 mm", "3 to 6 mm thick"};
        Random random = new Random(20_240_607L);
        for (int i = 0; i < 20_000; i++) {
            StringBuilder text = new StringBuilder();
            int parts = random.nextInt(14);
            for (int p = 0; p < parts; p++) {
                if (random.nextInt(10) == 0) {
                    text.append((char) random.nextInt(0x3000));
                } else {
                    text.append(vocabulary[random.nextInt(vocabulary.length)]);
                }
                if (random.nextInt(4) != 0) {
                    text.append(' ');
                }
            }
            assertOnlySyntaxErrors(text.toString());
        }
    }

    private static void assertOnlySyntaxErrors(String text) {
        try {
            Requirement r = RequirementParser.parse(text);
            assertThat(r.clauses()).as(text).isNotEmpty();
        } catch (RequirementSyntaxException e) {
            assertThat(e.position()).as(text).isBetween(0, text.length());
            assertThat(e.getMessage()).as(text).startsWith("at position " + e.position() + ": expected ");
        } catch (RequirementTooLargeException e) {
            // refused before reading: only a text beyond the cap, or with more clauses than judged
            assertThat(text.length() > RequirementLimits.MAX_TEXT_LENGTH || e.measure() == RequirementTooLargeException.Measure.CLAUSES)
                    .as(text).isTrue();
        } catch (RuntimeException e) {
            throw new AssertionError("'" + text + "' raised " + e, e);
        }
    }
}

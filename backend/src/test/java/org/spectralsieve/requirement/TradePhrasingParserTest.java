package org.spectralsieve.requirement;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.catchThrowableOfType;
import static org.spectralsieve.requirement.Aggregate.EVERY_POINT;
import static org.spectralsieve.requirement.Aggregate.MEAN;
import static org.spectralsieve.requirement.Direction.BLOCK;
import static org.spectralsieve.requirement.Direction.PASS;
import static org.spectralsieve.requirement.ThresholdUnit.FRACTION;
import static org.spectralsieve.requirement.ThresholdUnit.OPTICAL_DENSITY;
import static org.spectralsieve.requirement.ThresholdUnit.PERCENT;

import java.util.List;
import java.util.Optional;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.CsvSource;
import java.util.stream.Stream;
import org.spectralsieve.weighting.Emitter;
import org.spectralsieve.weighting.EmitterCatalogue;
import org.spectralsieve.weighting.Response;
import org.spectralsieve.weighting.SpectrumLookup;

/**
 * The trade's own phrasing, read as the trade means it (issue 9 part 5). What the phrases mean is common
 * practice, no source, except where noted: "blocks 99 %" keeps 99 % of the light out, so at most 1 % gets
 * through; "UV400" blocks up to 400 nm (PRACTICE.md, safety eyewear, [S14]) to at most 1 % (common
 * practice, no source); "visible transmittance" is τv (REFERENCE.md §5). Where a phrase has two readings
 * the parser refuses it and shows both; the checks below apply each offered form and read it back.
 */
class TradePhrasingParserTest {

    private static final List<String> DEMO_CLASSES = List.of("coating", "film", "fused silica", "laminate",
            "mask film", "optical glass", "other", "plastic sheet", "resin-tank sheet", "window glass");

    private static Requirement meaning(String text) {
        return RequirementParserTest.withoutTexts(RequirementParser.parse(text));
    }

    private static TransmittanceClause only(String text) {
        Requirement r = RequirementParser.parse(text);
        assertThat(r.clauses()).hasSize(1);
        return (TransmittanceClause) r.clauses().get(0);
    }

    private static RequirementSyntaxException refusal(String text) {
        return catchThrowableOfType(RequirementSyntaxException.class, () -> RequirementParser.parse(text));
    }

    /** The text with the refused span replaced by a suggestion, as the web page's suggestion buttons do. */
    private static String applied(String text, RequirementSyntaxException e, String suggestion) {
        int end = e.position() + e.length();
        return text.substring(0, e.position()) + suggestion + text.substring(end);
    }

    // ---- a blocked share ----

    @ParameterizedTest(name = "{0}")
    @CsvSource(delimiter = '|', textBlock = """
            blocks 99% at 405 nm                     | 0.01
            blocks 99.9% at 405 nm                   | 0.001
            blocks over 99% at 405 nm                | 0.01
            blocks more than 99% at 405 nm           | 0.01
            blocks at least 99.99% at 405 nm         | 0.0001
            blocks >= 99% at 405 nm                  | 0.01
            blocks 99% or more at 405 nm             | 0.01
            Blocks 95 % at 405nm                     | 0.05
            """)
    void blocksNinetyNinePercentKeepsAtMostOnePercentThrough(String text, double through) {
        TransmittanceClause clause = only(text);
        assertThat(clause.direction()).isEqualTo(BLOCK);
        assertThat(clause.thresholdT()).isEqualTo(through);
        assertThat(clause.unit()).isEqualTo(PERCENT);
        assertThat(clause.band()).isEqualTo(Band.at(405));
    }

    @Test
    void blocksNinetyNinePercentIsTheSameRequirementAsBlocksUnderOnePercent() {
        assertThat(meaning("blocks 99% at 405 nm")).isEqualTo(meaning("blocks under 1% at 405 nm"));
    }

    @Test
    void blocksNinetyNinePointNinePercentOfUvIsAtMostOneTenthPercentAtEveryPointOfTheBand() {
        TransmittanceClause clause = only("blocks 99.9% of UV from 290 to 400 nm");
        assertThat(clause).isEqualTo(new TransmittanceClause(BLOCK, EVERY_POINT, new Band(290, 400), 0.001, PERCENT,
                "blocks 99.9% of UV from 290 to 400 nm"));
    }

    @Test
    void aMeanBlockedShareOfUvIsAMeanCeiling() {
        TransmittanceClause clause = only("blocks mean 99% of uv between 315 and 400 nm");
        assertThat(clause.aggregate()).isEqualTo(MEAN);
        assertThat(clause.thresholdT()).isEqualTo(0.01);
        assertThat(clause.band()).isEqualTo(new Band(315, 400));
    }

    @Test
    void aBlockedShareAsAFractionStaysAFraction() {
        TransmittanceClause clause = only("blocks 0.99 at 405 nm");
        assertThat(clause.thresholdT()).isEqualTo(0.01);
        assertThat(clause.unit()).isEqualTo(FRACTION);
    }

    @Test
    void aBlockedShareOfAnEmittersLightIsACeilingOnTheWeightedTransmittance() {
        WeightedClause clause = (WeightedClause) RequirementParser.parse("blocks 99% of led 405").clauses().get(0);
        assertThat(clause.direction()).isEqualTo(BLOCK);
        assertThat(clause.thresholdT()).isEqualTo(0.01);
    }

    @Test
    void blocksFiftyPercentReadsTheSameEitherWay() {
        assertThat(only("blocks 50% at 550 nm").thresholdT()).isEqualTo(0.5);
        assertThat(meaning("blocks 50% at 550 nm")).isEqualTo(meaning("blocks under 50% at 550 nm"));
    }

    @Test
    void blockingAllTheLightIsRefusedWithTheStrongFormsToUseInstead() {
        RequirementSyntaxException e = refusal("blocks 100% at 405 nm");
        assertThat(e.position()).isEqualTo(7);
        assertThat(e.expected()).contains("below 100%").contains("OD 4");
    }

    // ---- levels with two readings: refused, both shown, each offered form reads as it says ----

    @ParameterizedTest(name = "{0}")
    @CsvSource(delimiter = '|', textBlock = """
            blocks 1% at 405 nm                                 | 0  | blocks 1%             | blocks under 1%      | 0.01  | transmits under 99%      | 0.99
            blocks 10 % at 405 nm                               | 0  | blocks 10 %           | blocks under 10%     | 0.1   | transmits under 90%      | 0.9
            blocks under 99% at 405 nm                          | 0  | blocks under 99%      | blocks under 1%      | 0.01  | transmits under 99%      | 0.99
            blocks at most 95% at 405 nm                        | 0  | blocks at most 95%    | blocks under 5%      | 0.05  | transmits under 95%      | 0.95
            blocks over 10% at 405 nm                           | 0  | blocks over 10%       | blocks under 10%     | 0.1   | transmits under 90%      | 0.9
            blocks 1% or more at 405 nm                         | 0  | blocks 1% or more     | blocks under 1%      | 0.01  | transmits under 99%      | 0.99
            blocks 0.1 at 405 nm                                | 0  | blocks 0.1            | blocks under 0.1     | 0.1   | transmits under 0.9      | 0.9
            blocks mean 5% from 290 to 400 nm                   | 0  | blocks mean 5%        | blocks mean under 5% | 0.05  | transmits mean under 95% | 0.95
            passes over 80% at 365 nm and blocks 1% at 405 nm   | 30 | blocks 1%             | blocks under 1%      | 0.01  | transmits under 99%      | 0.99
            """)
    void anAmbiguousBlockingLevelIsRefusedWithBothReadingsTheStricterFirst(String text, int position, String span,
            String strict, double strictT, String loose, double looseT) {
        RequirementSyntaxException e = refusal(text);

        assertThat(e.position()).isEqualTo(position);
        assertThat(text.substring(e.position(), e.position() + e.length())).isEqualTo(span);
        assertThat(e.suggestions()).containsExactly(strict, loose);
        assertThat(e.getMessage()).contains("'" + strict + "'").contains("'" + loose + "'").contains("did you mean '" + strict + "'");
        Requirement strictReading = RequirementParser.parse(applied(text, e, strict));
        Requirement looseReading = RequirementParser.parse(applied(text, e, loose));
        assertThat(strictReading.clauses().get(strictReading.clauses().size() - 1))
                .extracting("direction", "thresholdT").containsExactly(BLOCK, strictT);
        assertThat(looseReading.clauses().get(looseReading.clauses().size() - 1))
                .extracting("direction", "thresholdT").containsExactly(BLOCK, looseT);
    }

    @Test
    void noWordingOfBlocksEverLetsMoreThanHalfTheLightThrough() {
        // the safety property behind the refusals: whatever "blocks" level is accepted keeps at least half out
        String[] comparisons = {"", "under ", "over ", "at most ", "at least ", "below ", "above ", "<= ", ">= "};
        String[] numbers = {"0.1", "1", "5", "10", "49.9", "50", "50.1", "60", "90", "99", "99.9", "99.99"};
        for (String comparison : comparisons) {
            for (String number : numbers) {
                String text = "blocks " + comparison + number + "% at 405 nm";
                try {
                    assertThat(only(text).thresholdT()).as(text).isLessThanOrEqualTo(0.5);
                } catch (RequirementSyntaxException refused) {
                    assertThat(refused.suggestions()).as(text).hasSize(2);
                }
            }
        }
    }

    // ---- transmits / T: the comparison decides ----

    @Test
    void transmitsOverEightyPercentIsAPassingLevel() {
        assertThat(meaning("transmits over 80% at 365 nm")).isEqualTo(meaning("passes over 80% at 365 nm"));
        assertThat(meaning("transmittance at least 80% at 365 nm")).isEqualTo(meaning("passes over 80% at 365 nm"));
    }

    @Test
    void tGreaterThanWithAUnitJoinedToItsNumberIsAPassingLevel() {
        assertThat(meaning("T > 80% at 365nm")).isEqualTo(meaning("passes over 80% at 365 nm"));
        assertThat(meaning("T >= 80% from 360nm to 370nm")).isEqualTo(meaning("passes over 80% from 360 to 370 nm"));
    }

    @Test
    void transmitsUnderAnyLevelIsACeiling() {
        assertThat(only("T < 1% at 405 nm")).extracting("direction", "thresholdT").containsExactly(BLOCK, 0.01);
        assertThat(only("transmits under 70% at 550 nm")).extracting("direction", "thresholdT").containsExactly(BLOCK, 0.7);
    }

    @ParameterizedTest(name = "{0}")
    @CsvSource(delimiter = '|', textBlock = """
            transmits 80% at 365 nm | transmits 80% | transmits over 80% | transmits under 80%
            T 80% at 365 nm         | T 80%         | T over 80%         | T under 80%
            """)
    void transmitsWithoutAComparisonIsRefusedWithBothSides(String text, String span, String over, String under) {
        RequirementSyntaxException e = refusal(text);
        assertThat(e.position()).isZero();
        assertThat(text.substring(0, e.length())).isEqualTo(span);
        assertThat(e.suggestions()).containsExactly(over, under);
        assertThat(e.expected()).contains("at least 80%").contains("at most 80%");
        assertThat(only(applied(text, e, over)).direction()).isEqualTo(PASS);
        assertThat(only(applied(text, e, under)).direction()).isEqualTo(BLOCK);
    }

    // ---- UV ratings ----

    @Test
    void uv400BlocksToOnePercentFrom290UpTo400nm() {
        assertThat(only("UV400")).isEqualTo(new TransmittanceClause(BLOCK, EVERY_POINT, new Band(290, 400), 0.01, PERCENT,
                "UV400"));
        assertThat(meaning("UV400")).isEqualTo(meaning("blocks under 1% from 290 to 400 nm"));
    }

    @Test
    void uv400WithAStatedLevelUsesThatLevel() {
        assertThat(only("UV400 under 0.5%")).extracting("thresholdT", "unit").containsExactly(0.005, PERCENT);
        assertThat(only("uv 400 at most 0.001")).extracting("thresholdT", "unit").containsExactly(0.001, FRACTION);
        assertThat(only("UV400 OD 3")).extracting("thresholdT", "unit").containsExactly(0.001, OPTICAL_DENSITY);
    }

    @Test
    void uv420ReachesPastTheViolet405nmLineThatUv400Misses() {
        // PRACTICE.md, safety eyewear [S14]: a 405 nm laser passes UV400 lenses but not UV420 ones
        assertThat(only("UV420").band()).isEqualTo(new Band(290, 420));
        assertThat(only("UV400").band().toNm()).isLessThan(405);
    }

    @Test
    void aUvRatingJoinsOtherClausesAndLeavesUvHazardAlone() {
        Requirement r = RequirementParser.parse("UV400 and passes over 30% at 550 nm and uv hazard under 0.1%");
        assertThat(r.clauses()).hasSize(3);
        assertThat(r.clauses().get(2)).isInstanceOf(WeightedClause.class);
    }

    @ParameterizedTest(name = "[{0}]")
    @CsvSource(delimiter = '|', quoteCharacter = '"', textBlock = """
            UV40                                   | 2  | a UV rating from UV300 to UV500            | -
            UV4000                                 | 2  | a UV rating from UV300 to UV500            | -
            UV400 over 1%                          | 6  | 'under', 'below', 'less than', 'at most' or '<=' after 'UV400' | -
            UV400 1%                               | 6  | a comparison such as 'under' before the number | -
            UV400 undr 1%                          | 6  | after '400'                                | under
            blocks 99% of UV                       | 16 | 'from', 'between' or 'at' after 'of UV'    | -
            blocks 99% of UV, at 3 mm              | 16 | where UV starts differs                    | -
            blocks 99% of UV frm 290 to 400 nm     | 17 | after 'of UV'                              | from
            """)
    void malformedUvPhrasesAreRefusedWhereTheProblemIs(String text, int position, String fragment, String suggestion) {
        RequirementSyntaxException e = refusal(text);
        assertThat(e.getMessage()).startsWith("at position " + position + ": expected ").contains(fragment);
        assertThat(e.suggestion()).isEqualTo("-".equals(suggestion) ? Optional.empty() : Optional.of(suggestion));
    }

    @Test
    void anImportedEmitterNamedUvStaysReachableWhenNoBandFollows() {
        SpectrumLookup withUvLamp = new SpectrumLookup() {
            @Override
            public List<Emitter> emitters() {
                return Stream.concat(EmitterCatalogue.all().stream(), Stream.of(Emitter.led("uv-lamp", 370, 20))).toList();
            }

            @Override
            public List<Response> responses() {
                return Response.catalogue();
            }
        };
        WeightedClause lamp = (WeightedClause) RequirementParser.parse("blocks 99% of UV lamp", withUvLamp).clauses().get(0);
        assertThat(((Weighting.Spectral) lamp.weighting()).emitter().name()).isEqualTo("uv-lamp");
        assertThat(RequirementParser.parse("blocks 99% of UV from 290 to 400 nm", withUvLamp).clauses().get(0))
                .isInstanceOf(TransmittanceClause.class);
    }

    // ---- visible transmittance ----

    @ParameterizedTest(name = "{0}")
    @CsvSource(delimiter = '|', textBlock = """
            visible over 70%
            visible transmittance over 70%
            Visible light transmittance at least 70%
            VLT over 70%
            """)
    void visibleTransmittanceIsTheLuminousTransmittance(String text) {
        assertThat(meaning(text)).isEqualTo(meaning("luminous over 70%"));
    }

    // ---- thickness with its word last, and between ----

    @ParameterizedTest(name = "{0}")
    @CsvSource(delimiter = '|', textBlock = """
            passes over 80% at 365 nm, 3 to 6 mm thick            | 3 | 6
            passes over 80% at 365 nm, 3-6 mm thick               | 3 | 6
            passes over 80% at 365 nm, 3 mm to 6 mm thick         | 3 | 6
            passes over 80% at 365 nm, thickness between 3 and 6 mm | 3 | 6
            passes over 80% at 365 nm, thickness between 3 mm and 6 mm | 3 | 6
            passes over 80% at 365 nm, thickness from 3 to 6 mm   | 3 | 6
            3 to 6 mm thick, passes over 80% at 365 nm            | 3 | 6
            """)
    void aThicknessRangeReadsInTheUsualWordOrders(String text, double min, double max) {
        assertThat(RequirementParser.parse(text).thickness()).isEqualTo(ThicknessSpec.range(min, max));
    }

    @Test
    void sixMillimetresThickIsAFixedThickness() {
        assertThat(RequirementParser.parse("blocks under 1% at 405 nm, 6 mm thick").thickness()).isEqualTo(ThicknessSpec.at(6));
    }

    @ParameterizedTest(name = "[{0}]")
    @CsvSource(delimiter = '|', quoteCharacter = '"', textBlock = """
            passes over 80% at 365 nm, 3 to 6 mm                      | 36 | 'thick' after a thickness (or put the word first: 'thickness 3 to 6 mm') | -
            passes over 80% at 365 nm, 3 to 6 mm thik                 | 37 | 'thick'                                      | thick
            passes over 80% at 365 nm, thickness between 3 to 6 mm    | 47 | 'and' after 'between 3'                      | -
            passes over 80% at 365 nm, thickness between 6 and 3 mm   | 51 | a thickness not below 6 mm                   | -
            passes over 80% at 365 nm, thickness from 3 6 mm          | 44 | 'to' or '-' after 'from 3'                   | -
            passes over 80% at 365 nm, 3 to 6 mm thick, at 3 mm       | 44 | at most one thickness statement              | -
            passes over 80% at 365 nm, thickness betwen 3 and 6 mm    | 37 | 'as measured', 'between', 'from' or a thickness in mm after 'thickness' | between
            """)
    void malformedThicknessPhrasesAreRefusedWhereTheProblemIs(String text, int position, String fragment, String suggestion) {
        RequirementSyntaxException e = refusal(text);
        assertThat(e.getMessage()).startsWith("at position " + position + ": expected ").contains(fragment);
        assertThat(e.suggestion()).isEqualTo("-".equals(suggestion) ? Optional.empty() : Optional.of(suggestion));
    }

    // ---- class filters against the library's classes ----

    private static RequirementSyntaxException classRefusal(String text, List<String> classes) {
        return catchThrowableOfType(RequirementSyntaxException.class,
                () -> RequirementParser.parse(text, SpectrumLookup.builtIn(), classes));
    }

    @Test
    void anUnknownClassIsRefusedListingTheLibrarysClassesAndTheCloseOne() {
        String text = "blocks under 1% at 405 nm and luminous over 70%, class plastic";
        RequirementSyntaxException e = classRefusal(text, DEMO_CLASSES);

        assertThat(e.position()).isEqualTo(text.indexOf("plastic"));
        assertThat(e.length()).isEqualTo("plastic".length());
        assertThat(e.expected()).startsWith("a material class of the library (coating, film, fused silica")
                .contains("window glass");
        assertThat(e.suggestions()).containsExactly("plastic sheet");
        assertThat(e.unknownSpectrum()).isFalse();
        assertThat(RequirementParser.parse(applied(text, e, "plastic sheet"), SpectrumLookup.builtIn(), DEMO_CLASSES)
                .materialClass()).contains("plastic sheet");
    }

    @ParameterizedTest(name = "class {0}")
    @CsvSource(delimiter = '|', textBlock = """
            glass         | optical glass, window glass
            plastc sheet  | plastic sheet
            films         | film, mask film
            resin         | resin-tank sheet
            rubber        | ''
            """)
    void anUnknownClassSuggestsTheClassesItIsCloseTo(String written, String expected) {
        RequirementSyntaxException e = classRefusal("passes over 80% at 365 nm, class " + written, DEMO_CLASSES);
        List<String> suggestions = expected.isEmpty() ? List.of() : List.of(expected.split(", "));
        assertThat(e.suggestions()).containsExactlyElementsOf(suggestions);
    }

    @Test
    void aKnownClassIsAcceptedInAnyCase() {
        Requirement r = RequirementParser.parse("passes over 80% at 365 nm, class Mask  Film", SpectrumLookup.builtIn(),
                DEMO_CLASSES);
        assertThat(r.materialClass()).contains("mask film");
    }

    @Test
    void aClassFilterOnAnEmptyLibrarySaysSo() {
        RequirementSyntaxException e = classRefusal("passes over 80% at 365 nm, class film", List.of());
        assertThat(e.expected()).contains("the library holds no materials yet");
    }

    @Test
    void withoutALibraryAnyWellFormedClassIsKept() {
        assertThat(RequirementParser.parse("passes over 80% at 365 nm, class plastic").materialClass()).contains("plastic");
    }

    // ---- the canonical text ----

    @Test
    void aParsedBlockedShareRendersAsItsCeiling() {
        assertThat(RequirementParser.render(RequirementParser.parse("blocks 99% at 405 nm"))).isEqualTo("blocks at most 1% at 405 nm");
        assertThat(RequirementParser.render(RequirementParser.parse("UV400 under 0.5%")))
                .isEqualTo("blocks at most 0.5% from 290 to 400 nm");
    }

    @Test
    void aCeilingAboveHalfRendersWithTransmitsAndReadsBack() {
        for (double t : new double[] {0.5, 0.5000000000000001, 0.7, 0.99, 1.0}) {
            for (ThresholdUnit unit : List.of(PERCENT, FRACTION)) {
                Requirement model = new Requirement(List.of(new TransmittanceClause(BLOCK, EVERY_POINT, Band.at(550), t,
                        unit, "")), ThicknessSpec.AS_MEASURED, Optional.empty(), Optional.empty(), "");
                String text = RequirementParser.render(model);
                assertThat(text).as(text).startsWith(t > 0.5 ? "transmits at most " : "blocks at most ");
                assertThat(RequirementParserTest.withoutTexts(RequirementParser.parse(text))).as(text).isEqualTo(model);
            }
        }
    }

    @Test
    void aWeightedCeilingAboveHalfRendersWithTransmitsAndReadsBack() {
        Requirement parsed = RequirementParser.parse("transmits under 85% of led 385");
        String text = RequirementParser.render(parsed);
        assertThat(text).isEqualTo("transmits at most 85% of led-385");
        assertThat(meaning(text)).isEqualTo(RequirementParserTest.withoutTexts(parsed));
    }
}

package org.spectralsieve.requirement;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.catchThrowable;
import static org.spectralsieve.requirement.Direction.BLOCK;
import static org.spectralsieve.requirement.Direction.PASS;
import static org.spectralsieve.requirement.ThresholdUnit.OPTICAL_DENSITY;
import static org.spectralsieve.requirement.ThresholdUnit.PERCENT;

import java.util.List;
import java.util.Optional;
import java.util.stream.Stream;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.Arguments;
import org.junit.jupiter.params.provider.CsvSource;
import org.junit.jupiter.params.provider.MethodSource;
import org.spectralsieve.weighting.Emitter;
import org.spectralsieve.weighting.EmitterCatalogue;
import org.spectralsieve.weighting.Response;
import org.spectralsieve.weighting.SpectrumLookup;

/**
 * The language's weighted clauses, critical wavelength and fixed layers. Wordings are the trade's as
 * users say them (common practice, no source); "critical wavelength over 370 nm" is the broad-spectrum
 * test of the US FDA 2011 rule (REFERENCE §3, secondary sources); OD = -log10 T (ANSI Z80.3-2001 §3.2).
 */
class FigureClauseParserTest {

    private static final SpectrumLookup BUILT_IN = SpectrumLookup.builtIn();

    /** The built-in catalogues plus an imported photoinitiator response, as the application's lookup would hold it. */
    static final SpectrumLookup WITH_IMPORTED = new SpectrumLookup() {
        private final Response initiator = Response.tabulated("tpo initiator", "illustrative absorbance of a"
                + " photoinitiator, imported", new double[] {350, 380, 400, 420}, new double[] {0.2, 1.0, 0.6, 0.05});

        @Override
        public List<Emitter> emitters() {
            return EmitterCatalogue.all();
        }

        @Override
        public List<Response> responses() {
            return Stream.concat(Response.catalogue().stream(), Stream.of(initiator)).toList();
        }
    };

    private static Emitter emitter(String name) {
        return BUILT_IN.emitter(name).orElseThrow();
    }

    private static WeightedClause of(Direction d, double t, ThresholdUnit unit, String emitter, String response) {
        return new WeightedClause(d, t, unit, Weighting.of(emitter(emitter),
                Optional.ofNullable(response).map(r -> WITH_IMPORTED.response(r).orElseThrow())), "");
    }

    private static Requirement req(Clause... clauses) {
        return new Requirement(List.of(clauses), ThicknessSpec.AS_MEASURED, Optional.empty(), Optional.empty(), "");
    }

    private static Requirement req(FixedLayer layer, ThicknessSpec thickness, Clause... clauses) {
        return new Requirement(List.of(clauses), thickness, Optional.empty(), Optional.empty(), Optional.of(layer), "");
    }

    private static TransmittanceClause block(double nm, double t) {
        return new TransmittanceClause(BLOCK, Aggregate.EVERY_POINT, Band.at(nm), t, PERCENT, "");
    }

    static Stream<Arguments> validRequirements() {
        WeightedClause led365 = of(PASS, 0.85, PERCENT, "led-365", null);
        return Stream.of(
                Arguments.of("passes over 85% of led 365", req(led365)),
                Arguments.of("passes over 85% of led-365", req(led365)),
                Arguments.of("passes over 85% of LED365", req(led365)),
                Arguments.of("over 85% of led 365", req(led365)),
                Arguments.of("passes at least 85 % of Led - 365", req(led365)),
                Arguments.of("passes over 60% of led 395 weighted by erythema",
                        req(of(PASS, 0.60, PERCENT, "led-395", "erythema"))),
                Arguments.of("passes over 60% of led 395 weighted by tpo initiator",
                        req(of(PASS, 0.60, PERCENT, "led-395", "tpo initiator"))),
                Arguments.of("passes over 50% of mercury low pressure weighted by actinic-uv",
                        req(of(PASS, 0.50, PERCENT, "mercury-low-pressure", "actinic-uv"))),
                Arguments.of("passes over 80% of illuminant a", req(of(PASS, 0.80, PERCENT, "illuminant-a", null))),
                Arguments.of("blocks under 1% of led 405", req(of(BLOCK, 0.01, PERCENT, "led-405", null))),
                Arguments.of("OD 3 or more of led-405", req(of(BLOCK, 0.001, OPTICAL_DENSITY, "led-405", null))),
                Arguments.of("erythemal under 1%", req(new WeightedClause(BLOCK, 0.01, PERCENT,
                        Weighting.erythemal(BUILT_IN), ""))),
                Arguments.of("Erythemal transmittance below 1%", req(new WeightedClause(BLOCK, 0.01, PERCENT,
                        Weighting.erythemal(BUILT_IN), ""))),
                Arguments.of("erythemal OD 2 or more", req(new WeightedClause(BLOCK, 0.01, OPTICAL_DENSITY,
                        Weighting.erythemal(BUILT_IN), ""))),
                Arguments.of("uv hazard under 0.1%", req(new WeightedClause(BLOCK, 0.001, PERCENT,
                        Weighting.uvHazard(BUILT_IN), ""))),
                Arguments.of("UV-hazard at most 0.1%", req(new WeightedClause(BLOCK, 0.001, PERCENT,
                        Weighting.uvHazard(BUILT_IN), ""))),
                Arguments.of("luminous over 40%", req(new WeightedClause(PASS, 0.40, PERCENT, Weighting.luminous(), ""))),
                Arguments.of("luminous transmittance at least 0.7 and blocks under 1% at 405 nm",
                        req(new WeightedClause(PASS, 0.7, ThresholdUnit.FRACTION, Weighting.luminous(), ""), block(405, 0.01))),
                Arguments.of("critical wavelength over 370 nm",
                        req(new CriticalWavelengthClause(Comparison.AT_LEAST, 370, ""))),
                Arguments.of("critical wavelength at most 0.38 µm",
                        req(new CriticalWavelengthClause(Comparison.AT_MOST, 380, ""))),
                Arguments.of("blocks under 1% at 405 nm, behind 4 mm clear float glass",
                        req(new FixedLayer(FixedLayer.Placement.BEHIND, 4, "clear float glass", ""), ThicknessSpec.AS_MEASURED,
                                block(405, 0.01))),
                Arguments.of("on 3 mm Fused Silica and blocks under 1% at 405 nm, thickness 0.05 to 0.25 mm",
                        req(new FixedLayer(FixedLayer.Placement.ON, 3, "fused silica", ""), ThicknessSpec.range(0.05, 0.25),
                                block(405, 0.01))),
                Arguments.of("blocks under 1% at 405 nm and behind 4mm clear-float-glass",
                        req(new FixedLayer(FixedLayer.Placement.BEHIND, 4, "clear-float-glass", ""), ThicknessSpec.AS_MEASURED,
                                block(405, 0.01))),
                Arguments.of("erythemal under 1% and critical wavelength over 370 nm, behind 6.38 mm laminated glass pvb",
                        req(new FixedLayer(FixedLayer.Placement.BEHIND, 6.38, "laminated glass pvb", ""), ThicknessSpec.AS_MEASURED,
                                new WeightedClause(BLOCK, 0.01, PERCENT, Weighting.erythemal(BUILT_IN), ""),
                                new CriticalWavelengthClause(Comparison.AT_LEAST, 370, ""))));
    }

    @ParameterizedTest(name = "{0}")
    @MethodSource("validRequirements")
    void readsEachWordingIntoTheExpectedRecords(String text, Requirement expected) {
        assertThat(RequirementParserTest.withoutTexts(RequirementParser.parse(text, WITH_IMPORTED))).isEqualTo(expected);
    }

    @ParameterizedTest(name = "{0}")
    @MethodSource("validRequirements")
    void canonicalRenderingReadsBackToTheSameRequirement(String text, Requirement expected) {
        Requirement parsed = RequirementParser.parse(text, WITH_IMPORTED);
        String rendered = RequirementParser.render(parsed);
        assertThat(RequirementParserTest.withoutTexts(RequirementParser.parse(rendered, WITH_IMPORTED))).as(rendered)
                .isEqualTo(RequirementParserTest.withoutTexts(parsed));
    }

    @ParameterizedTest(name = "{0}")
    @org.junit.jupiter.params.provider.CsvSource(delimiter = '|', value = {
            "passes over 50% of led 372 15                      | led-372-15",
            "passes over 50% of LED-372-15 and blocks under 1% at 405 nm | led-372-15",
            "passes over 50% of led 395 10 16 weighted by erythema | led-395-10-16",
            "blocks under 5% of blackbody 3000 k                | blackbody-3000k",
            "passes over 1% of mercury 1 0.5 0.2 0.1             | mercury-1-0.5-0.2-0.1"})
    void aDescribedEmitterIsReadByItsNumbersAndRendersBackToItsName(String text, String emitterName) {
        Requirement parsed = RequirementParser.parse(text, BUILT_IN);
        WeightedClause clause = (WeightedClause) parsed.clauses().get(0);
        Weighting.Spectral weighting = (Weighting.Spectral) clause.weighting();
        assertThat(weighting.emitter().name()).isEqualTo(emitterName);
        String rendered = RequirementParser.render(parsed);
        assertThat(rendered).contains("of " + emitterName);
        Requirement again = RequirementParser.parse(rendered, BUILT_IN);
        assertThat(RequirementParser.render(again)).isEqualTo(rendered);
        assertThat(again.clauses()).hasSameSizeAs(parsed.clauses());
    }

    @Test
    void anUnknownEmitterNameTellsTheDescribedForms() {
        RequirementSyntaxException e = org.assertj.core.api.Assertions.catchThrowableOfType(
                RequirementSyntaxException.class, () -> RequirementParser.parse("passes over 50% of lamp 9", BUILT_IN));
        assertThat(e.getMessage()).contains("led-<peak nm>").contains("blackbody-<K>k");
    }

    @Test
    void renderingWritesStoredNamesAndInclusiveThresholds() {
        Requirement r = RequirementParser.parse("passes over 60% of LED 395 weighted by Erythema and uv hazard under 0.1%"
                + " and critical wavelength over 370 nm, behind 4 mm Clear Float Glass", BUILT_IN);
        assertThat(RequirementParser.render(r)).isEqualTo("passes at least 60% of led-395 weighted by erythema"
                + " and uv hazard at most 0.1% and critical wavelength at least 370 nm, behind 4 mm clear float glass");
    }

    @Test
    void clauseAndLayerTextsQuoteTheirSlices() {
        Requirement r = RequirementParser.parse("erythemal under 1%, behind 4 mm Clear Float Glass", BUILT_IN);
        assertThat(r.clauses().get(0).text()).isEqualTo("erythemal under 1%");
        assertThat(r.layer().orElseThrow().text()).isEqualTo("behind 4 mm Clear Float Glass");
        assertThat(r.plain()).isFalse();
    }

    @Test
    void anImportedNameIsUnknownToTheBuiltInLookupAndSaysSo() {
        Throwable thrown = catchThrowable(() -> RequirementParser.parse("passes over 60% of led 395 weighted by tpo initiator",
                BUILT_IN));
        RequirementSyntaxException e = (RequirementSyntaxException) thrown;
        assertThat(e.unknownSpectrum()).isTrue();
        assertThat(e.position()).isEqualTo(39);
        assertThat(e.length()).isEqualTo("tpo initiator".length());
        assertThat(e.expected()).startsWith("a response name (erythema, actinic-uv, blue-light").contains("flat");
    }

    // ---- malformed input: position, message fragment, suggestions ('-' for none), length (0: the word) ----

    @ParameterizedTest(name = "[{0}]")
    @CsvSource(delimiter = '|', quoteCharacter = '"', textBlock = """
            passes over 85% of led 356                              | 19 | an emitter name (led-365, led-385            | led-365      | 7
            passes over 85% of led 4O5                              | 19 | an emitter name                              | led-405      | 7
            passes over 85% of lde 365                              | 19 | after 'of'                                   | led-365      | 7
            passes over 85% of                                      | 18 | an emitter name                              | -            | 0
            passes over 85% of 365                                  | 19 | an emitter name                              | -            | 3
            passes over 60% of led 395 weighted by erythma          | 39 | a response name (erythema                    | erythema     | 7
            passes over 60% of led 395 weighted by bluelight hazard | 39 | after 'weighted by'                          | -            | 16
            passes over 60% of led 395 weighted erythema            | 36 | 'by' after 'weighted'                        | -            | 0
            mean over 85% of led 365                                | 14 | a weighted figure is an average already      | -            | 0
            erythemal 1%                                            | 10 | a comparison such as 'over' or 'under'       | -            | 0
            erythmal under 1%                                       | 0  | to start a clause                            | erythemal    | 0
            uv hazzard under 0.1%                                   | 3  | 'hazard' after 'uv'                          | hazard       | 0
            luminus over 40%                                        | 0  | to start a clause                            | luminous     | 0
            luminous 40%                                            | 9  | a comparison such as 'over' or 'under'       | -            | 0
            luminous over 40% of led 365                            | 18 | ',', 'and' or end of text after a clause     | -            | 0
            erythemal under 120%                                    | 16 | a percentage above 0 and at most 100         | -            | 0
            critical wavelength 370 nm                              | 20 | 'over', 'above'                              | -            | 0
            critical wavelength over 420 nm                         | 25 | a critical wavelength from 290 to 400 nm     | -            | 0
            critical wavelength over 370                            | 28 | 'nm', 'µm' or 'um' after '370'               | -            | 0
            critical wavelenght over 370 nm                         | 9  | 'wavelength' after 'critical'                | wavelength   | 0
            blocks under 1% at 405 nm, behind float glass           | 34 | the layer's thickness in mm                  | -            | 0
            blocks under 1% at 405 nm, behind 4 float glass         | 36 | 'mm' after '4'                               | -            | 0
            blocks under 1% at 405 nm, behind 4 mm                  | 38 | a library material                           | -            | 0
            blocks under 1% at 405 nm, behind 0 mm float glass      | 34 | a thickness above 0 and at most 1000 mm      | -            | 0
            blocks under 1% at 405 nm, behind 4 mm float % glass    | 45 | a library material: its slug or words         | -            | 0
            blocks under 1% at 405 nm, behind 4 mm glass, on 3 mm fused silica | 46 | at most one fixed layer, found a second one after 'behind 4 mm glass' | - | 0
            behind 4 mm clear float glass                           | 0  | a spectral clause such as 'passes            | -            | 0
            """)
    void refusesMalformedTextAtThePositionOfTheProblem(String text, int position, String fragment, String suggestion,
                                                      int length) {
        Throwable thrown = catchThrowable(() -> RequirementParser.parse(text, BUILT_IN));
        assertThat(thrown).isInstanceOf(RequirementSyntaxException.class);
        RequirementSyntaxException e = (RequirementSyntaxException) thrown;
        assertThat(e.getMessage()).startsWith("at position " + position + ": expected ").contains(fragment);
        assertThat(e.position()).isEqualTo(position);
        assertThat(e.suggestion()).isEqualTo("-".equals(suggestion) ? Optional.empty() : Optional.of(suggestion));
        assertThat(e.length()).isEqualTo(length);
    }

    @Test
    void aNameTwoEditsAwaySuggestsEveryCloseName() {
        // "led 375" is one edit from led-365, led-385 and led-395 alike, two from led-405
        RequirementSyntaxException e = (RequirementSyntaxException) catchThrowable(
                () -> RequirementParser.parse("passes over 85% of led 375", BUILT_IN));
        assertThat(e.suggestions().subList(0, 3)).containsExactlyInAnyOrder("led-365", "led-385", "led-395");
        assertThat(e.suggestions()).hasSize(4).endsWith("led-405");
        assertThat(e.unknownSpectrum()).isTrue();
    }
}

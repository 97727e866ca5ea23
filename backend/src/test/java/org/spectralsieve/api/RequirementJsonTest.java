package org.spectralsieve.api;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;

import java.util.Map;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.CsvSource;
import org.junit.jupiter.params.provider.ValueSource;
import org.junit.jupiter.api.Test;
import org.spectralsieve.requirement.Direction;
import org.spectralsieve.requirement.Requirement;
import org.spectralsieve.requirement.RequirementParser;
import org.spectralsieve.requirement.ThresholdUnit;
import org.spectralsieve.requirement.TransmittanceClause;
import org.spectralsieve.weighting.SpectrumLookup;
import tools.jackson.databind.JsonNode;
import tools.jackson.databind.json.JsonMapper;

/** The structured JSON form of a requirement; example wordings are trade presets (common practice, no source). */
class RequirementJsonTest {

    private static final JsonMapper MAPPER = JsonMapper.builder().build();

    private static JsonNode tree(Object value) {
        // through text, as a client would send it, not just through the in-memory tree
        return MAPPER.readTree(MAPPER.writeValueAsString(value));
    }

    @ParameterizedTest(name = "{0}")
    @ValueSource(strings = {
            "passes over 80% at 365 nm and blocks under 1% at 405 nm",
            "mean over 85% from 360 to 370 nm, thickness 1 to 6 mm, class plastic sheet, geometry regular",
            "OD at least 4 from 190 to 315 nm, at 3 mm",
            "OD at most 0.1 at 365 nm and passes over 0.8 at 0.4 µm",
            "10% cutoff between 380 and 395 nm and mean under 5% from 280 to 315 nm, geometry total",
            "passes over 85% of led 365 and passes over 60% of led 395 weighted by erythema, thickness 1 to 6 mm",
            "erythemal under 1% and uv hazard OD 3 or more and luminous over 40% and critical wavelength over 370 nm",
            "blocks under 1% at 405 nm and luminous at least 0.7, behind 4 mm clear float glass",
            "on 0.112 mm amber-masking-film and passes over 50% at 600 nm",
            "at 380 nm under 1% of its 550 nm value and at 400 nm under half of its 550 nm value, thickness 1 to 6 mm",
            "after 1000 h passes over 80% at 365 nm and after 50 J/cm² at 365 nm at 320 nm over 10% of its 550 nm value",
            "printed black blocks to OD 3 or more from 350 to 420 nm and base passes over 80% from 350 to 420 nm",
            "from 350 to 420 nm the printed black under 0.1% of the base and after 2000 h luminous over 40%"})
    void jsonRoundTripGivesBackTheSameRequirement(String text) {
        Requirement requirement = RequirementParser.parse(text);
        assertThat(RequirementJson.fromJson(tree(RequirementJson.toJson(requirement)))).isEqualTo(requirement);
    }

    @Test
    void jsonUsesTheDocumentedCamelCaseShape() {
        Requirement requirement = RequirementParser.parse("passes over 80% at 365 nm, cutoff between 380 and 395 nm, thickness 1 to 6 mm");
        JsonNode json = tree(RequirementJson.toJson(requirement));
        assertThat(json.get("thickness").get("kind").asString()).isEqualTo("range");
        assertThat(json.get("thickness").get("maxMm").doubleValue()).isEqualTo(6);
        assertThat(json.get("materialClass").isNull()).isTrue();
        JsonNode pass = json.get("clauses").get(0);
        assertThat(pass.get("type").asString()).isEqualTo("transmittance");
        assertThat(pass.get("direction").asString()).isEqualTo("pass");
        assertThat(pass.get("aggregate").asString()).isEqualTo("everyPoint");
        assertThat(pass.get("unit").asString()).isEqualTo("percent");
        assertThat(pass.get("thresholdT").doubleValue()).isEqualTo(0.8);
        assertThat(pass.get("text").asString()).isEqualTo("passes over 80% at 365 nm");
        assertThat(json.get("clauses").get(1).get("levelT").doubleValue()).isEqualTo(0.5);
    }

    @Test
    void thresholdMayBeGivenAsOpticalDensity() {
        // ANSI Z80.3-2001 §3.2: density = log10(1/T), so OD 3 is T = 0.001
        Requirement r = RequirementJson.fromJson(MAPPER.readTree("""
                {"clauses": [{"type": "transmittance", "direction": "block", "fromNm": 405, "toNm": 405, "thresholdOd": 3}]}"""));
        TransmittanceClause clause = (TransmittanceClause) r.clauses().get(0);
        assertThat(clause.direction()).isEqualTo(Direction.BLOCK);
        assertThat(clause.unit()).isEqualTo(ThresholdUnit.OPTICAL_DENSITY);
        assertThat(clause.thresholdT()).isCloseTo(0.001, org.assertj.core.data.Offset.offset(1e-15));
    }

    @ParameterizedTest(name = "{1}")
    @CsvSource(delimiter = '|', textBlock = """
            []                                                                                 | (root) must be an object
            {"clauses": []}                                                                    | clauses must be a non-empty list
            {"clauses": [{"type": "transmittance", "direction": "pass", "fromNm": 365, "toNm": 365, "thresholdT": 0.8}, {"type": "transmittance", "direction": "block", "fromNm": 405, "toNm": 405, "thresholdPercent": 120}]} | clauses[1].thresholdPercent must be a number above 0 and at most 100
            {"clauses": [{"type": "spectral"}]}                                                | clauses[0].type 'spectral' is not one of
            {"clauses": [{"type": "transmittance", "direction": "up", "fromNm": 365, "toNm": 365, "thresholdT": 0.8}]} | clauses[0].direction must be 'pass' or 'block'
            {"clauses": [{"type": "transmittance", "direction": "pass", "fromNm": "365", "toNm": 365, "thresholdT": 0.8}]} | clauses[0].fromNm must be a number
            {"clauses": [{"type": "transmittance", "direction": "pass", "fromNm": 50, "toNm": 365, "thresholdT": 0.8}]} | clauses[0].fromNm must be a wavelength from 100
            {"clauses": [{"type": "transmittance", "direction": "pass", "fromNm": 400, "toNm": 350, "thresholdT": 0.8}]} | clauses[0].toNm must not be below fromNm
            {"clauses": [{"type": "transmittance", "direction": "pass", "aggregate": "mean", "fromNm": 365, "toNm": 365, "thresholdT": 0.8}]} | clauses[0].toNm must be above fromNm
            {"clauses": [{"type": "transmittance", "direction": "pass", "fromNm": 365, "toNm": 365, "thresholdT": 1.5}]} | clauses[0].thresholdT must be a number above 0 and at most 1
            {"clauses": [{"type": "transmittance", "direction": "pass", "fromNm": 365, "toNm": 365}]} | clauses[0].thresholdT must be given
            {"clauses": [{"type": "transmittance", "direction": "pass", "fromNm": 365, "toNm": 365, "thresholdT": 0.8, "unit": "decibel"}]} | clauses[0].unit must be
            {"clauses": [{"type": "cutoff", "levelT": 1, "fromNm": 380, "toNm": 395}]}         | clauses[0].levelT must be a number above 0 and below 1
            {"clauses": [{"type": "cutoff", "fromNm": 380, "toNm": 380}]}                      | clauses[0].toNm must be above fromNm
            {"clauses": [{"type": "cutoff", "fromNm": 380, "toNm": 395}], "thickness": {"kind": "fixed", "mm": 0}} | thickness.mm must be a thickness above 0
            {"clauses": [{"type": "cutoff", "fromNm": 380, "toNm": 395}], "thickness": {"kind": "range", "minMm": 6, "maxMm": 1}} | thickness.maxMm must not be below minMm
            {"clauses": [{"type": "cutoff", "fromNm": 380, "toNm": 395}], "thickness": {"kind": "thick"}} | thickness.kind must be
            {"clauses": [{"type": "cutoff", "fromNm": 380, "toNm": 395}], "materialClass": "Plastic Sheet!"} | materialClass must be 2-40 lower-case letters
            {"clauses": [{"type": "cutoff", "fromNm": 380, "toNm": 395}], "geometry": "diffuse"} | geometry must be one of [regular, total, any]
            {"clauses": [{"type": "cutoff", "fromNm": 380, "toNm": 395}], "text": 5}           | text must be a string
            {"clauses": [{"type": "weighted", "direction": "pass", "emitter": "led-366", "thresholdT": 0.8}]} | clauses[0].emitter 'led-366' is not a known emitter; known: led-365
            {"clauses": [{"type": "weighted", "direction": "pass", "emitter": "led-365", "response": "tanning", "thresholdT": 0.8}]} | clauses[0].response 'tanning' is not a known response
            {"clauses": [{"type": "weighted", "direction": "pass", "thresholdT": 0.8}]}         | clauses[0].emitter must be given
            {"clauses": [{"type": "weighted", "preset": "sunburn", "direction": "block", "thresholdT": 0.01}]} | clauses[0].preset must be
            {"clauses": [{"type": "weighted", "preset": "erythemal", "direction": "block"}]}    | clauses[0].thresholdT must be given
            {"clauses": [{"type": "criticalWavelength", "comparison": "atLeast", "nm": 420}]}  | clauses[0].nm must be a wavelength from 290 to 400 nm
            {"clauses": [{"type": "criticalWavelength", "comparison": "over", "nm": 370}]}     | clauses[0].comparison must be 'atLeast' or 'atMost'
            {"clauses": [{"type": "cutoff", "fromNm": 380, "toNm": 395}], "layer": {"thicknessMm": 4}} | layer.material must be given
            {"clauses": [{"type": "cutoff", "fromNm": 380, "toNm": 395}], "layer": {"thicknessMm": -1, "material": "glass"}} | layer.thicknessMm must be a thickness above 0
            {"clauses": [{"type": "cutoff", "fromNm": 380, "toNm": 395}], "layer": {"placement": "under", "thicknessMm": 4, "material": "glass"}} | layer.placement must be
            {"clauses": [{"type": "cutoff", "fromNm": 380, "toNm": 395}], "layer": {"thicknessMm": 4, "material": "glass, tinted"}} | layer.material must be a slug
            {"clauses": [{"type": "cutoff", "fromNm": 380, "toNm": 395}], "layer": "glass"}   | layer must be an object
            {"clauses": [{"type": "relative", "direction": "block", "fromNm": 380, "toNm": 380, "share": 2, "referenceNm": 550}]} | clauses[0].share must be a fraction
            {"clauses": [{"type": "relative", "direction": "block", "fromNm": 380, "toNm": 380, "share": 0.01}]} | clauses[0] a curve relative to itself
            {"clauses": [{"type": "inState", "state": {"kind": "aged"}, "clause": {"type": "cutoff", "fromNm": 380, "toNm": 395}}]} | clauses[0].state.hours an aged state gives
            {"clauses": [{"type": "inState", "state": {"kind": "aged", "hours": -5}, "clause": {"type": "cutoff", "fromNm": 380, "toNm": 395}}]} | clauses[0].state.hours exposure hours must lie above 0
            {"clauses": [{"type": "inState", "state": {"kind": "worn"}, "clause": {"type": "cutoff", "fromNm": 380, "toNm": 395}}]} | clauses[0].state.kind must be
            {"clauses": [{"type": "inState", "state": {"kind": "printed"}}]} | clauses[0].clause must be an object
            """)
    void badFieldIsNamedByItsJsonPath(String json, String message) {
        assertThatThrownBy(() -> RequirementJson.fromJson(MAPPER.readTree(json)))
                .isInstanceOf(IllegalArgumentException.class)
                .hasMessageStartingWith(message);
    }

    @Test
    void weightedClauseNamesItsSpectraAndTheirRange() {
        Requirement requirement = RequirementParser.parse("passes over 85% of led 365 and erythemal under 1%");
        JsonNode json = tree(RequirementJson.toJson(requirement));
        JsonNode led = json.get("clauses").get(0);
        assertThat(led.get("type").asString()).isEqualTo("weighted");
        assertThat(led.get("preset").asString()).isEqualTo("emitter");
        assertThat(led.get("emitter").asString()).isEqualTo("led-365");
        assertThat(led.get("response").isNull()).isTrue();
        // the unweighted range of a Gaussian LED model: peak ± 3 FWHM = 365 ± 36 nm (EmitterCatalogue: 12 nm FWHM)
        assertThat(led.get("rangeNm").get(0).doubleValue()).isEqualTo(329);
        assertThat(led.get("rangeNm").get(1).doubleValue()).isEqualTo(401);
        assertThat(led.get("safetyFigure").asBoolean()).isFalse();
        JsonNode erythemal = json.get("clauses").get(1);
        assertThat(erythemal.get("preset").asString()).isEqualTo("erythemal");
        assertThat(erythemal.get("response").asString()).isEqualTo("erythema");
        assertThat(erythemal.get("safetyFigure").asBoolean()).isTrue();
        assertThat(json.get("layer").isNull()).isTrue();
    }

    @Test
    void nullMaterialClassAndGeometryMeanNoFilter() {
        Requirement r = RequirementJson.fromJson(tree(Map.of("clauses", java.util.List.of(Map.of("type", "cutoff",
                "fromNm", 380, "toNm", 395)))));
        assertThat(r.materialClass()).isEmpty();
        assertThat(r.geometry()).isEmpty();
        assertThat(r.text()).isEmpty();
    }

    @Test
    void anUnknownMaterialClassIsRefusedListingTheLibrarysClassesAndTheCloseOne() {
        JsonNode json = tree(Map.of("materialClass", "plastic", "clauses", java.util.List.of(Map.of("type", "cutoff",
                "fromNm", 380, "toNm", 395))));
        assertThatThrownBy(() -> RequirementJson.fromJson(json, SpectrumLookup.builtIn(),
                java.util.List.of("film", "plastic sheet", "window glass")))
                .isInstanceOf(IllegalArgumentException.class)
                .hasMessage("materialClass 'plastic' is not a class of the library; its classes: film, plastic sheet,"
                        + " window glass; did you mean 'plastic sheet'?");
    }

    @Test
    void aKnownMaterialClassIsKept() {
        JsonNode json = tree(Map.of("materialClass", "film", "clauses", java.util.List.of(Map.of("type", "cutoff",
                "fromNm", 380, "toNm", 395))));
        assertThat(RequirementJson.fromJson(json, SpectrumLookup.builtIn(), java.util.List.of("film")).materialClass())
                .contains("film");
    }

    @ParameterizedTest(name = "{0}")
    @ValueSource(strings = {"blocks 99% at 405 nm", "UV400 under 0.5%", "blocks 99.9% of UV from 290 to 400 nm",
            "transmits under 70% at 550 nm and T > 80% at 365nm", "visible over 70%, 3 to 6 mm thick",
            "blocks 99% of led 405, thickness between 3 and 6 mm"})
    void theTradesPhrasingRoundTripsThroughJsonAndItsCanonicalText(String text) {
        Requirement requirement = RequirementParser.parse(text);
        Requirement fromJson = RequirementJson.fromJson(tree(RequirementJson.toJson(requirement)));
        assertThat(fromJson).isEqualTo(requirement);
        Requirement fromCanonical = RequirementParser.parse(RequirementParser.render(fromJson));
        assertThat(RequirementJson.toJson(fromCanonical)).usingRecursiveComparison().ignoringFieldsMatchingRegexes(".*text")
                .isEqualTo(RequirementJson.toJson(requirement));
    }

    @Test
    void aStructuredBlockAboveHalfRendersAsATransmitsCeiling() {
        JsonNode json = tree(Map.of("clauses", java.util.List.of(Map.of("type", "transmittance", "direction", "block",
                "fromNm", 550, "toNm", 550, "thresholdPercent", 90))));
        Requirement r = RequirementJson.fromJson(json);
        assertThat(RequirementParser.render(r)).isEqualTo("transmits at most 90% at 550 nm");
        assertThat(((TransmittanceClause) RequirementParser.parse(RequirementParser.render(r)).clauses().get(0)).thresholdT())
                .isEqualTo(0.9);
    }
}

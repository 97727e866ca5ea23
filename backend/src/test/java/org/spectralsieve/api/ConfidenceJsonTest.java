package org.spectralsieve.api;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;
import static org.assertj.core.api.Assertions.within;

import java.util.List;
import java.util.Map;
import java.util.Optional;
import org.junit.jupiter.api.Test;
import org.spectralsieve.requirement.Candidate;
import org.spectralsieve.requirement.RankedRow;
import org.spectralsieve.requirement.Ranking;
import org.spectralsieve.requirement.Requirement;
import org.spectralsieve.requirement.RequirementParser;
import org.spectralsieve.spectrum.Curve;
import tools.jackson.databind.JsonNode;
import tools.jackson.databind.json.JsonMapper;

/** Confidence in the JSON of a requirement and of a search answer (illustrative curves). */
class ConfidenceJsonTest {

    private static final JsonMapper MAPPER = JsonMapper.builder().build();

    private static JsonNode tree(Object value) {
        return MAPPER.readTree(MAPPER.writeValueAsString(value));
    }

    @Test
    void aConfidenceDemandGoesToJsonInPercentAndComesBackUnchanged() {
        Requirement requirement = RequirementParser.parse("passes over 80% at 365 nm with 97.5% confidence and blocks under 1% at 405 nm");
        JsonNode json = tree(RequirementJson.toJson(requirement));

        assertThat(json.path("clauses").get(0).path("confidencePercent").asDouble()).isEqualTo(97.5);
        assertThat(json.path("clauses").get(1).path("confidencePercent").isNull()).isTrue();
        assertThat(RequirementJson.fromJson(json)).isEqualTo(requirement);
    }

    @Test
    void aJsonConfidenceOutsideFiftyTo99Point9IsRefusedNamingItsField() {
        String json = """
                {"clauses": [{"type": "transmittance", "direction": "pass", "fromNm": 365, "toNm": 365,
                              "thresholdPercent": 80, "confidencePercent": 99.99}]}""";
        assertThatThrownBy(() -> RequirementJson.fromJson(MAPPER.readTree(json)))
                .isInstanceOf(IllegalArgumentException.class)
                .hasMessageStartingWith("clauses[0].confidencePercent must be a number from 50 to 99.9").hasMessageEndingWith("got 99.99");
    }

    @Test
    void eachClauseOfAnAnswerCarriesItsConfidenceOrNull() {
        // T = 10^−0.671 = 21.33 % at 405 nm, σ_A 0.2, against "over 10 %": Φ((1 − 0.671)/0.2) = Φ(1.645) = 0.9500
        // (NIST/SEMATECH e-Handbook §1.3.6.7.1); the cutoff clause has no computed confidence
        double t = Math.pow(10, -0.671);
        Curve curve = Curve.of(new double[] {380, 400, 410}, new double[] {0.001, t, t}, 0)
                .withAbsorbanceUncertainty(new double[] {0.2, 0.2, 0.2});
        Requirement requirement = RequirementParser.parse("passes over 10% at 405 nm and cutoff at 1% between 370 and 395 nm");
        List<RankedRow> rows = Ranking.evaluateAndRank(
                List.of(new Candidate(1, 1, "illustrative sheet", curve, 2, false, null)), requirement, 1);

        Map<String, Object> row = ShortlistJson.row(rows.get(0), "regular");
        JsonNode clauses = tree(row).path("clauses");

        assertThat(clauses.get(0).path("confidence").asDouble()).isCloseTo(0.9500, within(1e-4));
        assertThat(clauses.get(1).has("confidence")).isTrue();
        assertThat(clauses.get(1).path("confidence").isNull()).isTrue();
    }
}

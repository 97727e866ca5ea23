package org.spectralsieve.api;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;

import java.util.List;
import java.util.Map;
import java.util.Optional;
import org.junit.jupiter.api.Test;
import org.spectralsieve.optics.Illumination;
import org.spectralsieve.requirement.Requirement;
import org.spectralsieve.requirement.RequirementParser;
import org.spectralsieve.search.Shortlist;
import tools.jackson.databind.JsonNode;
import tools.jackson.databind.json.JsonMapper;

/** How the light arrives, in the JSON of a requirement and of every search answer. */
class LightJsonTest {

    private static final JsonMapper MAPPER = JsonMapper.builder().build();

    private static JsonNode tree(Object value) {
        return MAPPER.readTree(MAPPER.writeValueAsString(value));
    }

    @Test
    void eachLightGoesToJsonAndComesBackUnchanged() {
        for (String words : new String[] {"", ", at 30° incidence", ", over a 60° beam", ", under an LED with 120° beam angle",
                ", under a Lambertian source"}) {
            Requirement requirement = RequirementParser.parse("passes over 80% at 365 nm" + words);
            JsonNode json = tree(RequirementJson.toJson(requirement));
            assertThat(json.path("light").path("description").asString()).isEqualTo(requirement.light().describe());
            assertThat(RequirementJson.fromJson(json)).as(words).isEqualTo(requirement);
        }
        JsonNode beam = tree(RequirementJson.toJson(RequirementParser.parse("passes over 80% at 365 nm, over a 60° beam")));
        assertThat(beam.path("light").path("kind").asString()).isEqualTo("beam");
        assertThat(beam.path("light").path("fullAngleDeg").asDouble()).isEqualTo(60);
        assertThat(beam.path("light").path("integration").asString()).contains("48 angles");
    }

    @Test
    void aJsonRequirementWithoutLightIsNormalIncidence() {
        JsonNode json = MAPPER.readTree("""
                {"clauses": [{"type": "transmittance", "direction": "pass", "fromNm": 365, "toNm": 365, "thresholdPercent": 80}]}""");
        assertThat(RequirementJson.fromJson(json).light()).isEqualTo(Illumination.NORMAL);
    }

    @Test
    void aBadLightIsRefusedNamingItsField() {
        String clauses = "\"clauses\": [{\"type\": \"transmittance\", \"direction\": \"pass\", \"fromNm\": 365, \"toNm\": 365,"
                + " \"thresholdPercent\": 80}]";
        assertThatThrownBy(() -> RequirementJson.fromJson(MAPPER.readTree("{" + clauses + ", \"light\": {\"kind\": \"sideways\"}}")))
                .isInstanceOf(IllegalArgumentException.class).hasMessageStartingWith("light.kind must be");
        assertThatThrownBy(() -> RequirementJson.fromJson(MAPPER.readTree("{" + clauses
                + ", \"light\": {\"kind\": \"incidence\", \"angleDeg\": 95}}")))
                .isInstanceOf(IllegalArgumentException.class).hasMessageStartingWith("light.angleDeg");
        assertThatThrownBy(() -> RequirementJson.fromJson(MAPPER.readTree("{" + clauses + ", \"light\": {\"kind\": \"led\"}}")))
                .isInstanceOf(IllegalArgumentException.class).hasMessageStartingWith("light.beamAngleDeg must be a number");
    }

    @Test
    void everyAnswerSaysWhichLightItAssumed() {
        for (String words : new String[] {"", ", under an LED with 120° beam angle"}) {
            Requirement requirement = RequirementParser.parse("passes over 80% at 365 nm" + words);
            Shortlist empty = new Shortlist(requirement, List.of(), 0, 0, 0, Optional.empty(), Map.of());
            JsonNode json = tree(ShortlistJson.toJson(empty));
            assertThat(json.path("assumedLight").asString()).isEqualTo(requirement.light().describe());
        }
        assertThat(tree(ShortlistJson.toJson(new Shortlist(RequirementParser.parse("passes over 80% at 365 nm"), List.of(), 0, 0,
                0, Optional.empty(), Map.of()))).path("assumedLight").asString()).contains("normal incidence");
    }
}

package org.spectralsieve.requirement;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;

import java.util.List;
import org.junit.jupiter.api.Test;

/** Splitting words about the stock and provenance terms from a requirement's clauses, keeping positions. */
class RequirementWordsTest {

    private static final List<String> PROVENANCES = List.of("measured", "datasheet", "modelled");

    private static RequirementWords split(String text) {
        return RequirementWords.split(text, PROVENANCES);
    }

    @Test
    void leadingWordsAreSplitFromTheFirstClauseAndItsPositionIsKept() {
        String text = "clear acrylic passes over 80% at 400 nm";
        RequirementWords words = split(text);

        assertThat(words.words()).isEqualTo("clear acrylic");
        assertThat(words.any()).isTrue();
        assertThat(words.maskedText()).hasSameSizeAs(text).isEqualTo("              passes over 80% at 400 nm");
        Requirement clauses = RequirementParser.parse(words.maskedText());
        assertThat(clauses.clauses()).hasSize(1);
        assertThat(clauses.clauses().get(0).text()).isEqualTo("passes over 80% at 400 nm");
    }

    @Test
    void aRequirementWithoutWordsIsLeftExactlyAsTyped() {
        for (String text : List.of("passes over 80% at 365 nm and blocks under 1% at 405 nm, thickness 1 to 6 mm",
                "class film and blocks under 1% at 405 nm", "cutoff between 380 and 395 nm", "UV400 and visible over 70%",
                "at 3 mm, passes over 80% at 254 nm", "6 mm thick, passes over 50% at 365 nm", "geometry total, T over 5% at 550 nm")) {
            RequirementWords words = split(text);
            assertThat(words.any()).as(text).isFalse();
            assertThat(words.maskedText()).as(text).isEqualTo(text);
        }
    }

    @Test
    void aProvenanceTermMayLeadOrStandAsAnItemOfItsOwn() {
        RequirementWords leading = split("acrylic provenance measured and passes over 80% at 400 nm");
        assertThat(leading.words()).isEqualTo("acrylic");
        assertThat(leading.provenances()).containsExactly("measured");
        assertThat(RequirementParser.parse(leading.maskedText()).clauses()).hasSize(1);

        RequirementWords between = split("passes over 80% at 365 nm and provenance datasheet and blocks under 1% at 405 nm");
        assertThat(between.words()).isEmpty();
        assertThat(between.provenances()).containsExactly("datasheet");
        assertThat(RequirementParser.parse(between.maskedText()).clauses()).hasSize(2);

        RequirementWords last = split("film, passes over 80% at 400 nm, provenance Modelled");
        assertThat(last.words()).isEqualTo("film");
        assertThat(last.provenances()).containsExactly("modelled");
        assertThat(RequirementParser.parse(last.maskedText()).text().strip()).isEqualTo("passes over 80% at 400 nm");
    }

    @Test
    void anUnknownProvenanceIsAProblemAtItsWordWithTheCloseValue() {
        String text = "acrylic provenance mesured and passes over 80% at 400 nm";
        assertThatThrownBy(() -> split(text)).isInstanceOfSatisfying(RequirementSyntaxException.class, e -> {
            assertThat(e.position()).isEqualTo(text.indexOf("mesured"));
            assertThat(e.expected()).contains("provenance").contains("measured");
            assertThat(e.suggestions()).containsExactly("measured");
        });
    }

    @Test
    void aLeadingWordASlipAwayFromAKeywordIsMarkedForTheCallerToCheck() {
        RequirementWords words = split("acrylic pases over 80% at 400 nm");

        assertThat(words.words()).isEqualTo("acrylic pases");
        assertThat(words.typos()).containsExactly(new RequirementWords.Slip("pases", 8, "passes"));
        assertThat(split("glazing passes over 80% at 400 nm").typos()).isEmpty();
    }
}

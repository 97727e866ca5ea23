package org.spectralsieve.requirement;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;

import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.CsvSource;
import org.junit.jupiter.params.provider.ValueSource;
import org.junit.jupiter.api.Test;
import org.spectralsieve.states.StateKind;

/** The words for states and relative levels: what they read as, their canonical text, and their errors. */
class StateAndRelativeParsingTest {

    @Test
    void anArchivalGlazingRuleReadsAsThreeRelativeClausesOnTheSameCurve() {
        // the shape of the museum-glazing rule (PRACTICE.md §6 check 31, [S28])
        Requirement r = RequirementParser.parse("at 380 nm under 1% of its 550 nm value and at 320 nm under 1% of its"
                + " 550 nm value and at 400 nm under half of its 550 nm value");
        assertThat(r.clauses()).hasSize(3).allMatch(c -> c instanceof RelativeClause);
        RelativeClause half = (RelativeClause) r.clauses().get(2);
        assertThat(half.direction()).isEqualTo(Direction.BLOCK);
        assertThat(half.fraction()).isEqualTo(0.5);
        assertThat(half.band()).isEqualTo(Band.at(400));
        assertThat(half.referenceNm()).isEqualTo(550);
        assertThat(r.namesStates()).isFalse();
        assertThat(r.plain()).isFalse(); // the store does not screen it: exact judgement for every row
    }

    @Test
    void aStateBeforeAClauseReadsThatStatesCurve() {
        Requirement r = RequirementParser.parse("after 1000 h passes over 80% at 365 nm and printed black blocks to OD 3"
                + " or more from 350 to 420 nm and base passes over 80% from 350 to 420 nm");
        StateClause aged = (StateClause) r.clauses().get(0);
        assertThat(aged.state()).isEqualTo(StateAsked.afterHours(1000));
        assertThat(aged.inner()).isInstanceOf(TransmittanceClause.class);
        assertThat(((StateClause) r.clauses().get(1)).state().kind()).isEqualTo(StateKind.PRINTED);
        // the base is the sample's own curve: a plain clause, the words kept
        assertThat(r.clauses().get(2)).isInstanceOf(TransmittanceClause.class);
        assertThat(r.clauses().get(2).text()).isEqualTo("base passes over 80% from 350 to 420 nm");
        assertThat(r.namesStates()).isTrue();
    }

    @ParameterizedTest
    @ValueSource(strings = {"after 50 J/cm² at 365 nm passes over 80% at 365 nm",
            "after 50 J/cm2 at 365 nm passes over 80% at 365 nm"})
    void aDoseIsJoulesPerSquareCentimetreAtAWavelength(String text) {
        StateClause s = (StateClause) RequirementParser.parse(text).clauses().get(0);
        assertThat(s.state()).isEqualTo(StateAsked.afterDose(50, 365));
    }

    @Test
    void aStateBeforeTheBandIsTheOneCompared() {
        RelativeClause r = (RelativeClause) RequirementParser.parse(
                "printed black from 350 to 420 nm under 0.1% of the base").clauses().get(0);
        assertThat(r.state()).isEqualTo(StateAsked.PRINTED);
        assertThat(r.referenceState()).isEqualTo(StateAsked.AS_SUPPLIED);
        assertThat(r.text()).isEqualTo("printed black from 350 to 420 nm under 0.1% of the base");
        RelativeClause aged = (RelativeClause) RequirementParser.parse(
                "after 2000 h at 380 nm under 1% of its 550 nm value").clauses().get(0);
        assertThat(aged.state()).isEqualTo(StateAsked.afterHours(2000)).isEqualTo(aged.referenceState());
    }

    @Test
    void twoStatesCompareAtEachWavelength() {
        RelativeClause r = (RelativeClause) RequirementParser.parse(
                "from 350 to 420 nm the printed black under 0.1% of the base").clauses().get(0);
        assertThat(r.ownWavelength()).isFalse();
        assertThat(r.state()).isEqualTo(StateAsked.PRINTED);
        assertThat(r.referenceState()).isEqualTo(StateAsked.AS_SUPPLIED);
        assertThat(r.fraction()).isEqualTo(0.001);
        assertThat(r.readsStates()).isTrue();
    }

    @ParameterizedTest
    @ValueSource(strings = {
            "at 380 nm under 1% of its 550 nm value and at 400 nm over 50% of its 550 nm value, thickness 1 to 6 mm",
            "after 1000 h passes over 80% at 365 nm and after 50 J/cm² at 365 nm blocks under 1% from 300 to 320 nm",
            "after 2000 h at 380 nm under 1% of its 550 nm value",
            "from 350 to 420 nm the printed black under 0.1% of the base and printed black OD 3 or more at 405 nm",
            "from 300 to 320 nm after 2000 h over 20% of the new"})
    void theCanonicalTextReadsBackToTheSameRequirement(String text) {
        Requirement r = RequirementParser.parse(text);
        String canonical = RequirementParser.render(r);
        assertThat(RequirementParser.render(RequirementParser.parse(canonical))).isEqualTo(canonical);
        assertThat(RequirementParser.parse(canonical).clauses()).hasSameSizeAs(r.clauses());
    }

    @ParameterizedTest(name = "{0}")
    @CsvSource(delimiter = '|', quoteCharacter = '"', textBlock = """
            after 1000 passes over 80% at 365 nm                      | 11 | 'h', 'hours' or 'J/cm²'
            after 0 h passes over 80% at 365 nm                       | 6  | exposure hours must lie above 0
            after 50 J/cm² passes over 80% at 365 nm                  | 15 | 'at'
            at 380 nm under 1% of its value                           | 26 | a wavelength in nm
            at 380 nm under 150% of its 550 nm value                  | 16 | a share above 0 and at most 100%
            from 350 to 420 nm under 0.1% of the                      | 36 | 'its', 'the base'
            at 380 nm under 1% of its 380 nm value                    | 0  | a value relative to itself
            printed black from 350 to 420 nm the base under 1% of the base | 37 | (the state is named before the band already)
            from 350 to 420 nm under 1% of the base                   | 0  | a curve relative to itself
            printed black thickness 1 to 6 mm                         | 14 | a spectral clause after 'printed black'
            """)
    void mistakesAreNamedWhereTheyAre(String text, int position, String expected) {
        assertThatThrownBy(() -> RequirementParser.parse(text))
                .isInstanceOf(RequirementSyntaxException.class)
                .hasMessageContaining("at position " + position + ":")
                .hasMessageContaining(expected);
    }
}

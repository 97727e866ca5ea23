package org.spectralsieve.requirement;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.catchThrowableOfType;

import java.util.List;
import java.util.OptionalDouble;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.CsvSource;
import org.junit.jupiter.params.provider.ValueSource;

/** "… with 95% confidence" in the requirement language (our own syntax, no external source). */
class ConfidenceDemandParserTest {

    private static TransmittanceClause only(Requirement r, int i) {
        return (TransmittanceClause) r.clauses().get(i);
    }

    @Test
    void aClauseEndingWithAConfidenceCarriesItAsAFraction() {
        Requirement r = RequirementParser.parse("passes over 80% at 365 nm with 95% confidence and blocks under 1% at 405 nm");

        assertThat(only(r, 0).confidenceDemand()).isEqualTo(OptionalDouble.of(0.95));
        assertThat(only(r, 0).text()).isEqualTo("passes over 80% at 365 nm with 95% confidence");
        assertThat(only(r, 1).confidenceDemand()).isEmpty();
        assertThat(r.asksConfidence()).isTrue();
        assertThat(RequirementParser.parse("passes over 80% at 365 nm").asksConfidence()).isFalse();
    }

    @ParameterizedTest(name = "{0}")
    @CsvSource(delimiter = '|', value = {
            "passes over 80% at 365 nm with 95% confidence | passes at least 80% at 365 nm with 95% confidence",
            "mean over 85% from 360 to 370 nm with 99.9% confidence, at 3 mm | mean at least 85% from 360 to 370 nm with 99.9% confidence, at 3 mm",
            "OD 3 or more at 405 nm with 50% confidence | OD at least 3 at 405 nm with 50% confidence",
            "UV400 with 97.5% confidence | blocks at most 1% from 290 to 400 nm with 97.5% confidence"})
    void theCanonicalTextKeepsTheDemandAndReadsBackToTheSameClause(String text, String canonical) {
        Requirement parsed = RequirementParser.parse(text);
        String rendered = RequirementParser.render(parsed);

        assertThat(rendered).isEqualTo(canonical);
        Requirement again = RequirementParser.parse(rendered);
        assertThat(withoutText(again.clauses())).isEqualTo(withoutText(parsed.clauses()));
    }

    private static List<Clause> withoutText(List<Clause> clauses) {
        return clauses.stream().map(c -> c instanceof TransmittanceClause t
                ? new TransmittanceClause(t.direction(), t.aggregate(), t.band(), t.thresholdT(), t.unit(), "",
                t.confidenceDemand())
                : c).toList();
    }

    @ParameterizedTest(name = "{0}")
    @ValueSource(strings = {"40", "49.9", "99.95", "100"})
    void aConfidenceOutsideFiftyTo99Point9PercentIsRefusedAtItsNumber(String percent) {
        String text = "passes over 80% at 365 nm with " + percent + "% confidence";
        RequirementSyntaxException e = catchThrowableOfType(RequirementSyntaxException.class,
                () -> RequirementParser.parse(text));

        assertThat(e.position()).isEqualTo(text.indexOf(percent + "%"));
        assertThat(e.getMessage()).contains("a confidence from 50% to 99.9%").contains("'" + percent + "'%");
    }

    @Test
    void aConfidenceAfterACutoffOrAWeightedFigureIsRefusedWithTheReason() {
        String cutoff = "cutoff between 380 and 395 nm with 95% confidence";
        RequirementSyntaxException e = catchThrowableOfType(RequirementSyntaxException.class,
                () -> RequirementParser.parse(cutoff));

        assertThat(e.position()).isEqualTo(cutoff.indexOf("with"));
        assertThat(e.getMessage()).contains("a confidence can be asked only of a transmittance clause");
        assertThat(catchThrowableOfType(RequirementSyntaxException.class,
                () -> RequirementParser.parse("erythemal under 1% with 95% confidence")).getMessage())
                .contains("only of a transmittance clause");
    }

    @Test
    void aConfidenceWithoutItsPercentSignOrItsWordIsASyntaxError() {
        String noSign = "passes over 80% at 365 nm with 95 confidence";
        assertThat(catchThrowableOfType(RequirementSyntaxException.class, () -> RequirementParser.parse(noSign)).position())
                .isEqualTo(noSign.indexOf("confidence"));
        String noWord = "passes over 80% at 365 nm with 95%";
        assertThat(catchThrowableOfType(RequirementSyntaxException.class, () -> RequirementParser.parse(noWord)).position())
                .isEqualTo(noWord.length());
    }
}

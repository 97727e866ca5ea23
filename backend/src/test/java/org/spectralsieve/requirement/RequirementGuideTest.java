package org.spectralsieve.requirement;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatCode;

import java.util.List;
import org.junit.jupiter.api.Test;
import org.spectralsieve.weighting.SpectrumLookup;

/**
 * The guide on the page never promises what the parser refuses: every example it shows, every unit example
 * and every name it lists is read here by the parser itself, the same way the search reads it. What the
 * phrases mean is the language's own (docs/requirement-language.md); the one reading checked here, "blocks
 * 99 %" as at most 1 % through, is common practice, no source.
 */
class RequirementGuideTest {

    /** Illustrative classes, as a library files its materials. */
    private static final List<String> CLASSES = List.of("plastic sheet", "optical glass");
    private static final List<String> PROVENANCES = List.of("measured", "datasheet", "modelled");
    private static final SpectrumLookup SPECTRA = SpectrumLookup.builtIn();

    private final RequirementGuide guide = RequirementGuide.of(SPECTRA, CLASSES, PROVENANCES);

    @Test
    void everyClauseExampleIsReadByTheParser() {
        assertThat(guide.forms()).hasSizeGreaterThan(15);
        for (RequirementGuide.ClauseForm form : guide.forms()) {
            assertThatCode(() -> read(form.example())).as(form.name() + ": " + form.example()).doesNotThrowAnyException();
        }
    }

    @Test
    void everyUnitExampleIsReadByTheParser() {
        for (RequirementGuide.UnitRange unit : guide.units()) {
            assertThatCode(() -> read(unit.example())).as(unit.quantity() + ": " + unit.example()).doesNotThrowAnyException();
        }
    }

    @Test
    void examplesWithoutWordsAreReadByTheParserAlone() {
        guide.forms().stream().filter(f -> !f.words()).forEach(f ->
                assertThatCode(() -> RequirementParser.parse(f.example(), SPECTRA, CLASSES)).as(f.example())
                        .doesNotThrowAnyException());
    }

    @Test
    void wordsAndProvenanceExamplesCarryWhatTheSearchSplitsOff() {
        List<RequirementGuide.ClauseForm> worded = guide.forms().stream().filter(RequirementGuide.ClauseForm::words).toList();
        assertThat(worded).hasSize(2);
        for (RequirementGuide.ClauseForm form : worded) {
            assertThat(RequirementWords.split(form.example(), PROVENANCES).any()).as(form.example()).isTrue();
        }
    }

    @Test
    void theClassExampleNamesOneOfTheLibrarysClasses() {
        RequirementGuide.ClauseForm classForm = guide.forms().stream().filter(f -> f.example().contains("class ")).findFirst()
                .orElseThrow();
        assertThat(RequirementParser.parse(classForm.example(), SPECTRA, CLASSES).materialClass()).contains("plastic sheet");
        assertThat(guide.materialClasses()).isEqualTo(CLASSES);
    }

    @Test
    void aLibraryWithoutClassesOrProvenancesGetsNoExampleForThem() {
        RequirementGuide bare = RequirementGuide.of(SPECTRA, List.of(), List.of());
        assertThat(bare.forms()).noneMatch(f -> f.example().contains("class ") || f.example().contains("provenance"));
        bare.forms().forEach(f -> assertThatCode(() -> read(f.example())).doesNotThrowAnyException());
    }

    /** Common practice, no source: "blocks 99 %" keeps 99 % out, so at most 1 % gets through. */
    @Test
    void theShareKeptOutExampleReadsAsAtMostOnePercentThrough() {
        RequirementGuide.ClauseForm share = guide.forms().stream().filter(f -> f.example().startsWith("blocks 99%"))
                .findFirst().orElseThrow();
        TransmittanceClause clause = (TransmittanceClause) RequirementParser.parse(share.example()).clauses().get(0);
        assertThat(clause.direction()).isEqualTo(Direction.BLOCK);
        assertThat(clause.thresholdT()).isEqualTo(0.01, org.assertj.core.api.Assertions.within(1e-12));
    }

    @Test
    void everyListedEmitterAndResponseCanBeNamedInAWeightedClause() {
        assertThat(guide.emitters()).contains("led-365");
        assertThat(guide.responses()).contains("erythema");
        for (String emitter : guide.emitters()) {
            assertThatCode(() -> RequirementParser.parse("passes over 50% of " + emitter, SPECTRA)).as(emitter)
                    .doesNotThrowAnyException();
        }
        for (String response : guide.responses()) {
            assertThatCode(() -> RequirementParser.parse("passes over 50% of led 365 weighted by " + response, SPECTRA))
                    .as(response).doesNotThrowAnyException();
        }
    }

    @Test
    void everyListedGeometryIsAcceptedByTheGeometryFilter() {
        for (String geometry : guide.geometries()) {
            assertThatCode(() -> read("passes over 80% at 365 nm, geometry " + geometry)).doesNotThrowAnyException();
        }
    }

    /** As the search reads a text: words and provenance terms split off, the rest parsed at the same positions. */
    private static Requirement read(String text) {
        RequirementWords words = RequirementWords.split(text, PROVENANCES);
        return RequirementParser.parse(words.maskedText(), SPECTRA, CLASSES);
    }
}

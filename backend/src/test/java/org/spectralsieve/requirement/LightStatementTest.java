package org.spectralsieve.requirement;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;

import org.junit.jupiter.api.Test;
import org.spectralsieve.optics.Illumination;

/** The words that say how the light arrives, alone or with clauses, thickness and a part in front. */
class LightStatementTest {

    @Test
    void eachPhraseReadsAsItsLight() {
        assertThat(RequirementParser.parse("passes over 80% at 365 nm, at 30° incidence").light())
                .isEqualTo(Illumination.atIncidence(30));
        assertThat(RequirementParser.parse("passes over 80% at 365 nm and at 30 deg incidence").light())
                .isEqualTo(Illumination.atIncidence(30));
        assertThat(RequirementParser.parse("passes over 80% at 365 nm, over a 60° beam").light())
                .isEqualTo(new Illumination(Illumination.Kind.CONE, 30));
        assertThat(RequirementParser.parse("passes over 80% at 365 nm, under an LED with 120° beam angle").light())
                .isEqualTo(new Illumination(Illumination.Kind.LED, 60));
        assertThat(RequirementParser.parse("passes over 80% at 365 nm, under a Lambertian source").light())
                .isEqualTo(Illumination.lambertian());
        assertThat(RequirementParser.parse("passes over 80% at 365 nm").light()).isEqualTo(Illumination.NORMAL);
        assertThat(RequirementParser.parse("passes over 80% at 365 nm, at normal incidence").oblique()).isFalse();
    }

    @Test
    void overAndUnderStillBeginLevelsWhenNoArticleFollows() {
        Requirement r = RequirementParser.parse("over 80% at 365 nm, under 1% at 405 nm, over a 60° beam");
        assertThat(r.clauses()).hasSize(2);
        assertThat(r.light().kind()).isEqualTo(Illumination.Kind.CONE);
    }

    @Test
    void theLightGoesWithThicknessSolvingAndAPartInFront() {
        Requirement r = RequirementParser.parse(
                "passes over 80% at 365 nm and blocks under 1% at 300 nm, thickness 1 to 6 mm, behind 4 mm clear float glass,"
                        + " under an LED with 120° beam angle");
        assertThat(r.thickness().kind()).isEqualTo(ThicknessSpec.Kind.RANGE);
        assertThat(r.layer()).isPresent();
        assertThat(r.oblique()).isTrue();
        // the store's normal-incidence margins bound nothing at an angle: judged exactly
        assertThat(r.plain()).isFalse();
        assertThat(RequirementParser.parse("passes over 80% at 365 nm, at 3 mm").plain()).isTrue();
        assertThat(RequirementParser.parse("passes over 80% at 365 nm, at 3 mm, at 20° incidence").plain()).isFalse();
    }

    @Test
    void theCanonicalTextReadsBackToTheSameLight() {
        for (String text : new String[] {"passes over 80% at 365 nm, at 12.5° incidence",
                "blocks under 1% at 405 nm, over a 90° beam", "passes over 50% at 395 nm, under an LED with 30° beam angle",
                "passes over 50% at 395 nm, under a Lambertian source, at 3 mm"}) {
            Requirement r = RequirementParser.parse(text);
            Requirement again = RequirementParser.parse(RequirementParser.render(r));
            assertThat(again.light()).as(text).isEqualTo(r.light());
            assertThat(again.clauses()).hasSameSizeAs(r.clauses());
            assertThat(again.thickness()).isEqualTo(r.thickness());
        }
    }

    @Test
    void anglesOutsideWhatLightCanDoAreRefusedAtTheNumber() {
        assertThatThrownBy(() -> RequirementParser.parse("passes over 80% at 365 nm, at 90° incidence"))
                .isInstanceOf(RequirementSyntaxException.class)
                .satisfies(e -> assertThat(((RequirementSyntaxException) e).position()).isEqualTo(30))
                .hasMessageContaining("0° to 89°");
        assertThatThrownBy(() -> RequirementParser.parse("passes over 80% at 365 nm, over a 200° beam"))
                .isInstanceOf(RequirementSyntaxException.class).hasMessageContaining("180°");
        assertThatThrownBy(() -> RequirementParser.parse("passes over 80% at 365 nm, under an LED with 0° beam angle"))
                .isInstanceOf(RequirementSyntaxException.class).hasMessageContaining("above 0°");
    }

    @Test
    void aSecondLightOrAMissingWordIsNamed() {
        assertThatThrownBy(() -> RequirementParser.parse("passes over 80% at 365 nm, at 30° incidence, over a 60° beam"))
                .isInstanceOf(RequirementSyntaxException.class).hasMessageContaining("at most one statement of how the light");
        assertThatThrownBy(() -> RequirementParser.parse("passes over 80% at 365 nm, at 30°"))
                .isInstanceOf(RequirementSyntaxException.class).hasMessageContaining("'incidence'");
        assertThatThrownBy(() -> RequirementParser.parse("passes over 80% at 365 nm, under an LED with 120° beam"))
                .isInstanceOf(RequirementSyntaxException.class).hasMessageContaining("'angle'");
    }

    @Test
    void aLightParameterReadsOnItsOwn() {
        assertThat(RequirementParser.parseLight(null)).isEqualTo(Illumination.NORMAL);
        assertThat(RequirementParser.parseLight(" normal ")).isEqualTo(Illumination.NORMAL);
        assertThat(RequirementParser.parseLight("at 45 degrees incidence")).isEqualTo(Illumination.atIncidence(45));
        assertThatThrownBy(() -> RequirementParser.parseLight("sideways"))
                .isInstanceOf(RequirementSyntaxException.class).hasMessageContaining("at 30° incidence");
        assertThatThrownBy(() -> RequirementParser.parseLight("at 30° incidence please"))
                .isInstanceOf(RequirementSyntaxException.class).hasMessageContaining("end of text");
    }

    @Test
    void everyLightDescribesItselfAndSaysHowItWasIntegrated() {
        assertThat(Illumination.NORMAL.describe()).contains("normal incidence");
        assertThat(Illumination.atIncidence(30).describe()).contains("30° incidence");
        assertThat(Illumination.led(120).describe()).contains("120° beam angle").contains("cos^1 θ");
        assertThat(Illumination.beam(60).integration()).contains("48 angles").contains("Gauss–Legendre");
        assertThat(Illumination.atIncidence(30).integration()).isEmpty();
    }
}

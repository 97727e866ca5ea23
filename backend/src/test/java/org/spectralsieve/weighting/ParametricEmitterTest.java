package org.spectralsieve.weighting;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.within;

import org.junit.jupiter.api.Test;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.ValueSource;

/** Emitters described by their names: led-370-20, blackbody-3000k, mercury-…. */
class ParametricEmitterTest {

    @Test
    void anLedNameGivesAGaussianOfThatPeakAndWidthWhateverTheSeparators() {
        Emitter led = EmitterCatalogue.parametric("LED 370 20").orElseThrow();
        assertThat(led.name()).isEqualTo("led-370-20");
        // the same model as the explicit factory, point for point
        Emitter explicit = Emitter.led("x", 370, 20);
        for (double nm = 300; nm <= 440; nm += 0.5) {
            assertThat(led.powerAt(nm)).isEqualTo(explicit.powerAt(nm));
        }
        // definition of FWHM: half the peak power 10 nm either side of a 20 nm-wide line
        assertThat(led.powerAt(360) / led.powerAt(370)).isCloseTo(0.5, within(1e-12));
        assertThat(led.parameters()).containsEntry("peakNm", 370.0).containsEntry("fwhmNm", 20.0);
    }

    @Test
    void threeNumbersGiveTheAsymmetricLed() {
        Emitter led = EmitterCatalogue.parametric("led-395-10-16").orElseThrow();
        assertThat(led.powerAt(390) / led.powerAt(395)).isCloseTo(0.5, within(1e-12)); // short side: 10/2 nm
        assertThat(led.powerAt(403) / led.powerAt(395)).isCloseTo(0.5, within(1e-12)); // long side: 16/2 nm
    }

    /** Wien's displacement law (CODATA 2018 constant 2.897771955·10⁶ nm·K): 5000 K peaks at 579.55 nm. */
    @Test
    void aBlackbodyNameGivesPlanckAtThatTemperature() {
        Emitter bb = EmitterCatalogue.parametric("blackbody-5000k").orElseThrow();
        assertThat(bb.name()).isEqualTo("blackbody-5000k");
        assertThat(bb.powerAt(579.55)).isGreaterThan(bb.powerAt(575)).isGreaterThan(bb.powerAt(570));
        assertThat(bb.powerAt(579.55)).isGreaterThan(bb.powerAt(584));
        assertThat(bb.powerAt(560)).isCloseTo(100, within(1e-9));
    }

    @Test
    void aMercuryNameSetsTheFourLineStrengths() {
        Emitter hg = EmitterCatalogue.parametric("mercury-1-0.5-0.2-0.1").orElseThrow();
        assertThat(hg.parameters()).containsEntry("strength365.0nm", 0.5).containsEntry("strength435.8nm", 0.1);
    }

    @ParameterizedTest
    @ValueSource(strings = {"led-370", "led-5-12", "led-370-0.1", "led-370-500", "blackbody-10k", "mercury-0-0-0-0", "led", "lamp-3",
            "led-370-1-2-3"})
    void numbersOutsideTheirRangeOrOtherWordsAreNoName(String name) {
        assertThat(EmitterCatalogue.parametric(name)).isEmpty();
    }

    @Test
    void theLookupFindsListedNamesFirstThenDescribedOnes() {
        SpectrumLookup lookup = SpectrumLookup.builtIn();
        assertThat(lookup.emitter("led-365").orElseThrow()).isSameAs(EmitterCatalogue.named("led-365").orElseThrow());
        assertThat(lookup.emitter("led-372-15").orElseThrow().name()).isEqualTo("led-372-15");
        assertThat(lookup.emitter("no-such-lamp")).isEmpty();
    }
}

package org.spectralsieve.seedmodel;

import static org.assertj.core.api.Assertions.assertThat;

import org.junit.jupiter.api.Test;
import org.spectralsieve.spectrum.Curve;
import org.spectralsieve.spectrum.Cutoffs;

/**
 * The named edges on the demo's band-pass materials, which also open again in the red or near infrared:
 * the cutoff must be their UV absorption edge, and the pass band must hold the light they are chosen for.
 */
class BandPassEdgesTest {

    private static Curve curve(String slug, double thicknessMm) {
        MaterialSpec m = DemoCatalogue.materials().stream().filter(x -> x.slug().equals(slug)).findFirst().orElseThrow();
        SampleSpec s = m.samples().stream().filter(x -> Math.abs(x.thicknessMm() - thicknessMm) < 1e-9).findFirst()
                .orElseThrow(() -> new AssertionError(slug + " has no " + thicknessMm + " mm sample"));
        return SampleModeller.model(m.index(), s).toCurve();
    }

    @Test
    void uvPassBlackGlassHasItsPassBandAroundTheMercury365Line() {
        // common practice, no source: UV-pass black (Wood's type) glass passes about 300–400 nm, peaks near 365 nm,
        // blocks the visible and leaks in the near infrared
        for (double mm : new double[] {2, 3}) {
            Cutoffs.Edges edges = Cutoffs.edges(curve("uv-pass-black-glass", mm), 0.5);
            assertThat(edges.bandPass()).as(mm + " mm").isTrue();
            assertThat(edges.absorptionEdgeNm().getAsDouble()).as(mm + " mm").isBetween(280.0, 340.0);
            assertThat(edges.passBandEndNm().getAsDouble()).as(mm + " mm").isBetween(365.0, 420.0);
        }
    }

    @Test
    void greenLidSheetsCutoffIsItsBlueEdgeNotItsInfraredEdge() {
        // common practice, no source: a green tinted sheet passes green (about 500–560 nm) and absorbs the UV,
        // violet and red; dyed acrylics open again beyond about 700 nm
        Cutoffs.Edges edges = Cutoffs.edges(curve("resin-lid-green", 3), 0.5);
        assertThat(edges.absorptionEdgeNm().getAsDouble()).isBetween(450.0, 510.0);
        assertThat(edges.passBandEndNm().getAsDouble()).isBetween(530.0, 620.0);
        assertThat(520.0).isBetween(edges.absorptionEdgeNm().getAsDouble(), edges.passBandEndNm().getAsDouble());
    }

    @Test
    void longPassLidSheetsHaveNoPassBandEnd() {
        // common practice, no source: orange lid sheet blocks below about 500 nm and passes the red onwards
        Cutoffs.Edges edges = Cutoffs.edges(curve("resin-lid-orange", 3), 0.5);
        assertThat(edges.absorptionEdgeNm()).isPresent();
        assertThat(edges.passBandEndNm()).isEmpty();
    }
}

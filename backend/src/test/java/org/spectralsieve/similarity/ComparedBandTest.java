package org.spectralsieve.similarity;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;
import static org.assertj.core.api.Assertions.within;

import java.util.List;
import java.util.function.DoubleUnaryOperator;
import org.junit.jupiter.api.Test;
import org.spectralsieve.spectrum.Curve;

/**
 * Comparing over a band: only the grid points inside it count. Constructed curves that agree in one band and
 * differ in another (invented shapes, no source needed: which curve matches follows from the construction —
 * inside a band where two curves are identical point by point, their centred distance is zero by definition).
 */
class ComparedBandTest {

    private static final double FLOOR = 1e-4;

    /** An absorption edge (A falling from 2 to 0 around {@code centre}, 15 nm wide) — the UV edge of a sheet. */
    private static DoubleUnaryOperator edge(double centre) {
        return nm -> 1 - Math.tanh((nm - centre) / 15);
    }

    /** A dye band of absorbance {@code height} centred on 560 nm, 30 nm wide (a tint in the visible). */
    private static DoubleUnaryOperator dye(double height) {
        return nm -> height * Math.exp(-Math.pow((nm - 560) / 30, 2));
    }

    private static CurveSignature fixed(DoubleUnaryOperator absorbance) {
        double[] nm = new double[501];
        double[] t = new double[nm.length];
        for (int i = 0; i < nm.length; i++) {
            nm[i] = 200 + i;
            t[i] = Math.max(FLOOR, Math.pow(10, -absorbance.applyAsDouble(nm[i])));
        }
        return CurveSignature.of(Curve.of(nm, t, FLOOR), 3, false);
    }

    private static DoubleUnaryOperator sum(DoubleUnaryOperator a, DoubleUnaryOperator b) {
        return nm -> a.applyAsDouble(nm) + b.applyAsDouble(nm);
    }

    // the query: an edge at 360 nm and a dye band at 560 nm
    private static final CurveSignature QUERY = fixed(sum(edge(360), dye(0.8)));
    // same UV edge, no dye: agrees in the UV, differs in the visible
    private static final SimilarCurves.Candidate SAME_EDGE = new SimilarCurves.Candidate("same-edge", fixed(edge(360)));
    // the edge 40 nm longer, same dye: differs in the UV, agrees in the visible
    private static final SimilarCurves.Candidate SAME_DYE = new SimilarCurves.Candidate("same-dye",
            fixed(sum(edge(400), dye(0.8))));
    private static final List<SimilarCurves.Candidate> BOTH = List.of(SAME_EDGE, SAME_DYE);

    @Test
    void aBandChangesWhichCurveMatches() {
        for (ShapeMetric metric : ShapeMetric.values()) {
            List<SimilarHit> uv = SimilarCurves.rank(QUERY, BOTH, metric, new ComparedBand(300, 440), 2);
            List<SimilarHit> visible = SimilarCurves.rank(QUERY, BOTH, metric, new ComparedBand(480, 650), 2);
            assertThat(uv.get(0).id()).as(metric + " in the UV").isEqualTo("same-edge");
            assertThat(uv.get(0).distance()).as(metric.name()).isCloseTo(0, within(1e-6));
            assertThat(visible.get(0).id()).as(metric + " in the visible").isEqualTo("same-dye");
            // the edge at 400 nm has died away (tanh of 80/15 is 1 within 5e-5) before 480 nm
            assertThat(visible.get(0).distance()).as(metric.name()).isCloseTo(0, within(1e-3));
            assertThat(uv.get(1).distance()).isGreaterThan(0.01);
            assertThat(visible.get(1).distance()).isGreaterThan(0.01);
        }
    }

    @Test
    void onlyTheBandsGridPointsAreCompared() {
        // 300, 305, …, 440 nm: 29 points, all covered by both curves
        SimilarHit hit = SimilarCurves.rank(QUERY, List.of(SAME_DYE), ShapeMetric.CORRELATION,
                new ComparedBand(300, 440), 1).get(0);
        assertThat(hit.pointsCompared()).isEqualTo(29);
        assertThat(new ComparedBand(300, 440).gridPoints()).isEqualTo(29);
        assertThat(SimilarCurves.rank(QUERY, List.of(SAME_DYE), ShapeMetric.CORRELATION, 1).get(0).pointsCompared())
                .isEqualTo(CurveSignature.DIMENSION);
    }

    @Test
    void theBandDifferingMostLiesInsideTheComparedBand() {
        ComparedBand band = new ComparedBand(480, 650);
        for (ShapeMetric metric : ShapeMetric.values()) {
            SimilarHit hit = SimilarCurves.rank(QUERY, List.of(SAME_EDGE), metric, band, 1).get(0);
            // the missing dye differs most around its centre, 560 nm
            assertThat(hit.differingMost().fromNm()).isGreaterThanOrEqualTo(band.fromNm() - CurveSignature.STEP_NM / 2);
            assertThat(hit.differingMost().toNm()).isLessThanOrEqualTo(band.toNm() + CurveSignature.STEP_NM / 2);
            assertThat((hit.differingMost().fromNm() + hit.differingMost().toNm()) / 2).isCloseTo(560, within(15.0));
        }
    }

    @Test
    void withoutABandTheWholeGridIsCompared() {
        for (ShapeMetric metric : ShapeMetric.values()) {
            assertThat(SimilarCurves.rank(QUERY, BOTH, metric, 2))
                    .isEqualTo(SimilarCurves.rank(QUERY, BOTH, metric, ComparedBand.WHOLE_GRID, 2));
            assertThat(SimilarCurves.distance(QUERY, SAME_DYE.signature(), metric))
                    .isEqualTo(SimilarCurves.distance(QUERY, SAME_DYE.signature(), metric, ComparedBand.WHOLE_GRID));
        }
    }

    @Test
    void aBandIsReadAsFromDashToInNanometres() {
        assertThat(ComparedBand.parse("300-400")).isEqualTo(new ComparedBand(300, 400));
        assertThat(ComparedBand.parse(" 312.5 – 400 nm ")).isEqualTo(new ComparedBand(312.5, 400));
        assertThat(ComparedBand.parse("300 to 400")).isEqualTo(new ComparedBand(300, 400));
    }

    @Test
    void aBandOutsideTheGridBackwardsTooNarrowOrUnreadableIsRefusedSayingWhy() {
        assertThatThrownBy(() -> ComparedBand.parse("150-300")).hasMessageContaining("200–700 nm");
        assertThatThrownBy(() -> ComparedBand.parse("600-750")).hasMessageContaining("200–700 nm");
        assertThatThrownBy(() -> ComparedBand.parse("400-300")).hasMessageContaining("shorter");
        assertThatThrownBy(() -> ComparedBand.parse("400-400")).hasMessageContaining("shorter");
        // 300–340 nm holds 9 grid points; 10 (45 nm) is the least a shape can be told by
        assertThatThrownBy(() -> ComparedBand.parse("300-340")).hasMessageContaining("9 grid points");
        assertThat(ComparedBand.parse("300-345").gridPoints()).isEqualTo(SimilarCurves.MIN_COMMON_POINTS);
        assertThatThrownBy(() -> ComparedBand.parse("uv")).hasMessageContaining("FROM-TO");
        assertThatThrownBy(() -> ComparedBand.parse("-300-400")).hasMessageContaining("FROM-TO");
    }
}

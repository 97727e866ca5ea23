package org.spectralsieve.weighting;

import java.util.ArrayList;
import java.util.List;
import java.util.Objects;
import org.spectralsieve.spectrum.Curve;

/**
 * Every weighted figure of one curve for one choice of source, response, band convention and (optional)
 * reference solar spectrum: what the figures endpoint and the command line report. As in
 * {@link WeightedFigures#report}: computed with points below the detection limit at their limit, bounded
 * figures carry their other end (those points at 0), and nothing claims more than OD 12.
 */
public record FigureSheet(WeightedFigures.Report report, Figure upf, Figure luminousTransmittance,
                          SunglassCategory.Rating sunglassCategory) {

    public FigureSheet {
        Objects.requireNonNull(report, "report");
        Objects.requireNonNull(upf, "upf");
        Objects.requireNonNull(luminousTransmittance, "luminousTransmittance");
        Objects.requireNonNull(sunglassCategory, "sunglassCategory");
    }

    /** @param solar the reference solar spectrum for the UPF, or null: the UPF is then not available */
    public static FigureSheet of(Curve curve, Emitter emitter, Response response, UvBand.Convention convention,
                                 Emitter solar) {
        Curve upper = BoundedCurves.upperBounds(curve);
        Curve lower = BoundedCurves.lowerBounds(curve);
        Figure luminous = StatedLimits.transmittance(WeightedFigures.withEnd(LuminousTransmittance.of(upper),
                LuminousTransmittance.of(lower)));
        Figure upf = UltravioletProtectionFactor.withoutSolarSpectrum();
        if (solar != null) {
            upf = UltravioletProtectionFactor.of(upper, solar);
            Figure lowerUpf = UltravioletProtectionFactor.of(lower, solar);
            if (upf.bound() != Figure.Bound.VALUE && lowerUpf.available()
                    && lowerUpf.value().getAsDouble() < StatedLimits.MAX_STATED_FACTOR) {
                upf = upf.withOtherEnd(lowerUpf.value().getAsDouble());
            }
            upf = StatedLimits.factor(upf);
        }
        return new FigureSheet(WeightedFigures.report(curve, emitter, response, convention), upf, luminous,
                SunglassCategory.rate(luminous));
    }

    /** The figures in reading order: chosen pair, fixed screening figures, bands, edge, lines. */
    public List<Figure> figures() {
        List<Figure> all = new ArrayList<>();
        all.add(report.effectiveTransmittance());
        all.add(report.protectionFactor());
        all.add(report.erythemalProtectionFactor());
        all.add(report.actinicUvProtectionFactor());
        all.add(upf);
        all.add(luminousTransmittance);
        all.addAll(report.bandMeans());
        all.add(report.criticalWavelength());
        all.addAll(report.opticalDensities());
        return List.copyOf(all);
    }
}

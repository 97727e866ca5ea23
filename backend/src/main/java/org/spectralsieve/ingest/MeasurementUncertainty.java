package org.spectralsieve.ingest;

import java.util.ArrayList;
import java.util.Arrays;
import java.util.List;
import java.util.Locale;
import java.util.Optional;
import org.spectralsieve.importers.ParsedSpectrum;
import org.spectralsieve.importers.YKind;
import org.spectralsieve.spectrum.Curve;

/**
 * Gives an imported curve its per-point measurement uncertainty (one standard deviation in decadic
 * absorbance, see {@link Curve#absorbanceUncertainty(int)}) from, first that applies:
 * <ol>
 *   <li>the file's own standard deviations ({@link ParsedSpectrum#standardDeviations()}: a standard-deviation
 *       column, or the spread of averaged replicates), in the unit of the file's values unless the column
 *       names another ({@code absorbance_sd} as the project's own CSV writes it, {@code sd (A)});</li>
 *   <li>the instrument uncertainty the user states ({@link StatedUncertainty}), in %T or absorbance.</li>
 * </ol>
 * When both are given they are combined as independent components, σ² = σ_file² + σ_stated² (GUM JCGM
 * 100:2008, 5.1.2 with uncorrelated inputs): a file's standard deviation is the scatter of repeated scans
 * (repeatability), while an instrument's stated figure is its photometric accuracy; a verdict needs both, and
 * the repeatability alone (often a few hundredths of a %T) would make every confidence look surer than the
 * instrument is.
 *
 * <p>Transmittance uncertainties are converted to absorbance to first order (the law of propagation of
 * uncertainty, GUM JCGM 100:2008, 5.1.2): A = −log10 T, so |dA/dT| = 1/(T·ln 10) and
 * σ_A = σ_T / (T·ln 10). The first-order rule is only fair while σ_T is small against T; where
 * σ_T &gt; {@value #MAX_RELATIVE}·T the one-sigma interval of A is lopsided by more than a factor 1.7
 * (−log10(1 − 0.5) = 0.301 against log10(1 + 0.5) = 0.176) and reaches toward T = 0 where A is unbounded, so
 * such a point's uncertainty is left unknown (NaN) rather than stated with a false symmetry, and a warning
 * counts them. Points at or below detection are upper bounds, not readings: their uncertainty is unknown
 * (NaN) too; their bound already says what the data can show. An absorbance standard deviation (a file
 * in absorbance, or a stated ±A) is taken as it is.
 */
public final class MeasurementUncertainty {

    /** The largest relative transmittance uncertainty σ_T/T still converted to absorbance (see the class comment). */
    public static final double MAX_RELATIVE = 0.5;

    private static final double LN10 = Math.log(10);

    /** The curve with its uncertainty, and where that came from (empty when it has none). */
    public record Applied(Curve curve, Optional<String> source) {
    }

    private MeasurementUncertainty() {
    }

    /**
     * @param curve    the curve made from {@code parsed} (same points), detection limits applied
     * @param warnings receives a note when points are left without uncertainty or a stated one is unused
     */
    public static Applied apply(ParsedSpectrum parsed, Curve curve, Optional<StatedUncertainty> stated,
                                List<String> warnings) {
        if (parsed.hasStandardDeviations()) {
            double[] sd = onCurvePoints(parsed, curve);
            YKind kind = parsed.standardDeviationKind();
            double[] sigma = new double[curve.size()];
            List<Integer> tooWide = new ArrayList<>();
            for (int i = 0; i < sigma.length; i++) {
                sigma[i] = kind == YKind.ABSORBANCE
                        ? (curve.belowDetection(i) ? Double.NaN : sd[i])
                        : fromTransmittance(curve, i, kind == YKind.TRANSMITTANCE_PERCENT ? sd[i] / 100 : sd[i], tooWide);
            }
            warnTooWide(curve, tooWide, warnings);
            String unit = switch (kind) {
                case ABSORBANCE -> "absorbance";
                case TRANSMITTANCE_PERCENT -> "%T, converted to absorbance";
                case TRANSMITTANCE_FRACTION -> "transmittance fraction, converted to absorbance";
            };
            String source = "file: " + parsed.standardDeviationOrigin().orElse("standard deviations") + " (" + unit + ")";
            if (stated.isPresent()) {
                double[] instrument = statedSigma(curve, stated.get(), new ArrayList<>());
                for (int i = 0; i < sigma.length; i++) {
                    // an unknown component leaves the total unknown: half an uncertainty is not an uncertainty
                    sigma[i] = Math.hypot(sigma[i], instrument[i]);
                }
                source += " combined with the stated " + text(stated.get()) + " (root sum of squares)";
            }
            return applied(curve, sigma, source);
        }
        if (stated.isPresent()) {
            List<Integer> tooWide = new ArrayList<>();
            double[] sigma = statedSigma(curve, stated.get(), tooWide);
            warnTooWide(curve, tooWide, warnings);
            return applied(curve, sigma, "stated: " + text(stated.get()) + " at every point");
        }
        return new Applied(curve, Optional.empty());
    }

    /** The stated uncertainty at every point in absorbance; NaN at bounds and where it is too wide to convert. */
    private static double[] statedSigma(Curve curve, StatedUncertainty s, List<Integer> tooWide) {
        double[] sigma = new double[curve.size()];
        for (int i = 0; i < sigma.length; i++) {
            sigma[i] = s.scale() == StatedUncertainty.Scale.ABSORBANCE
                    ? (curve.belowDetection(i) ? Double.NaN : s.amount())
                    : fromTransmittance(curve, i, s.amount() / 100, tooWide);
        }
        return sigma;
    }

    /**
     * The file's standard deviations at the curve's points, matched by wavelength (a curve may keep fewer
     * points than the file, e.g. a keep range); NaN where the file has none.
     */
    private static double[] onCurvePoints(ParsedSpectrum parsed, Curve curve) {
        double[] nm = parsed.wavelengthsNm();
        double[] sd = parsed.standardDeviations();
        double[] out = new double[curve.size()];
        for (int i = 0; i < out.length; i++) {
            int j = Arrays.binarySearch(nm, curve.wavelengthNm(i));
            out[i] = j >= 0 ? sd[j] : Double.NaN;
        }
        return out;
    }

    /** σ_A = σ_T / (T·ln 10) at point i, NaN below detection or where σ_T/T exceeds {@link #MAX_RELATIVE}. */
    static double fromTransmittance(Curve curve, int i, double sigmaT, List<Integer> tooWide) {
        if (Double.isNaN(sigmaT) || curve.belowDetection(i)) {
            return Double.NaN;
        }
        double t = curve.transmittance(i);
        if (!(t > 0) || sigmaT > MAX_RELATIVE * t) {
            tooWide.add(i);
            return Double.NaN;
        }
        return sigmaT / (t * LN10);
    }

    private static Applied applied(Curve curve, double[] sigma, String source) {
        Curve with = curve.withAbsorbanceUncertainty(sigma);
        return new Applied(with, with.hasUncertainty() ? Optional.of(source) : Optional.empty());
    }

    private static void warnTooWide(Curve curve, List<Integer> tooWide, List<String> warnings) {
        if (tooWide.isEmpty()) {
            return;
        }
        warnings.add(tooWide.size() + " point" + (tooWide.size() == 1 ? "" : "s") + " between "
                + curve.wavelengthNm(tooWide.get(0)) + " and " + curve.wavelengthNm(tooWide.get(tooWide.size() - 1))
                + " nm have a standard deviation above " + (int) (MAX_RELATIVE * 100) + " % of their transmittance;"
                + " their absorbance uncertainty is left unknown (a first-order conversion would misstate it)");
    }

    /** "±0.5 %T", "±0.01 A": how a stated uncertainty is shown. */
    public static String text(StatedUncertainty s) {
        String amount = String.format(Locale.ROOT, "%s", stripZeros(s.amount()));
        return "±" + amount + (s.scale() == StatedUncertainty.Scale.PERCENT_T ? " %T" : " A");
    }

    private static String stripZeros(double v) {
        return new java.math.BigDecimal(Double.toString(v)).stripTrailingZeros().toPlainString();
    }
}

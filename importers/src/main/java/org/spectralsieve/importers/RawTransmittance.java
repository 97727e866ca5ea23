package org.spectralsieve.importers;

import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.TreeMap;

/**
 * The arithmetic from raw counts to transmittance, per point i (REFERENCE §11):
 *
 * <pre>
 *   T = ((S − D_S)/t_S) / ((R − D_R)/t_R)
 *   σ_S = σ_dark · √(n_dark / n_S)                     (noise of the sample reading, counts at t_S)
 *   T_LOD = 3 σ_S / t_S / ((R − D_R)/t_R)  = 3 σ_S · t_R / (t_S · (R − D_R))
 *   limit = max(T_LOD, stray-light floor); T ≤ limit is reported as "&lt; limit"
 * </pre>
 *
 * D_S and D_R are the darks taken at the sample's and the reference's own exposure. With t_S = t_R the
 * detection limit is REFERENCE §11's 3σ_dark/(R − D) (IUPAC Gold Book L03540, k = 3). The √(n_dark/n_S)
 * factor turns the spread of n_dark-scan averages into that of an n_S-scan average (the standard error
 * of a mean falls as 1/√n).
 *
 * <p>Darks: several dark captures at one exposure are repeated scans: D is their mean and σ their
 * sample standard deviation at each pixel. A single dark capture gives σ from its neighbouring pixels
 * (the sample standard deviation over ±{@link RawCountsOptions#noiseHalfWindow()} pixels), which also
 * counts fixed-pattern differences between pixels and so errs high, the safe side for a limit.
 * When no dark matches a capture's exposure, the dark nearest in exposure is used as it is, with a
 * warning: that assumes the dark is mostly detector offset (which does not grow with exposure) rather
 * than dark current (which does), and is exact only at equal exposures.
 *
 * <p>Exposures: each point takes the longest sample exposure and the longest reference exposure that
 * are not saturated there; a point where every sample or every reference capture is saturated, or
 * where the reference is not above the dark, is left out and named in the warnings.
 */
final class RawTransmittance {

    private static final int LISTED = 12;

    private final RawCounts raw;
    private final RawCountsOptions options;
    private final List<String> warnings = new ArrayList<>();
    private final Map<Double, DarkLevel> darks = new TreeMap<>();
    private final Map<Double, Boolean> warnedDark = new LinkedHashMap<>();

    private record DarkLevel(double exposureMs, double[] mean, double[] sigma, int scans, String method) {
    }

    RawTransmittance(RawCounts raw, RawCountsOptions options) {
        this.raw = raw;
        this.options = options;
    }

    RawCountsResult compute() throws ImportException {
        List<Capture> samples = raw.captures(CaptureRole.SAMPLE);
        List<Capture> references = raw.captures(CaptureRole.REFERENCE);
        List<Capture> darkCaptures = raw.captures(CaptureRole.DARK);
        String source = raw.sourceName();
        if (samples.isEmpty() || references.isEmpty() || darkCaptures.isEmpty()) {
            throw ImportException.ofSource(source, "transmittance needs dark, reference and sample captures; found "
                    + darkCaptures.size() + " dark, " + references.size() + " reference, " + samples.size() + " sample");
        }
        buildDarks(darkCaptures);
        boolean[][] sampleSat = saturation(samples);
        boolean[][] refSat = saturation(references);
        int n = raw.size();
        double[] x = new double[n];
        double[] t = new double[n];
        boolean[] bound = new boolean[n];
        double[] limits = new double[n];
        int[] index = new int[n];
        double[] ms = new double[n];
        List<Double> saturated = new ArrayList<>();
        List<Double> noReference = new ArrayList<>();
        int kept = 0;
        for (int i = 0; i < n; i++) {
            int s = longestUnsaturated(samples, sampleSat, i);
            int r = longestUnsaturated(references, refSat, i);
            if (s < 0 || r < 0) {
                saturated.add(raw.wavelength(i));
                continue;
            }
            Capture sc = samples.get(s);
            Capture rc = references.get(r);
            DarkLevel ds = darkFor(sc.exposureMs());
            DarkLevel dr = darkFor(rc.exposureMs());
            double refSignal = rc.count(i) - dr.mean()[i];
            if (!(refSignal > 0)) {
                noReference.add(raw.wavelength(i));
                continue;
            }
            double refRate = refSignal / rc.exposureMs();
            double sampleRate = (sc.count(i) - ds.mean()[i]) / sc.exposureMs();
            double sigma = ds.sigma()[i] * Math.sqrt((double) ds.scans() / sc.scans());
            double lod = RawCountsOptions.K * sigma / sc.exposureMs() / refRate;
            double limit = Math.max(lod, options.strayLightFloor());
            double value = sampleRate / refRate;
            x[kept] = raw.wavelength(i);
            bound[kept] = value <= limit;
            t[kept] = bound[kept] ? limit : value;
            limits[kept] = limit;
            index[kept] = s;
            ms[kept] = sc.exposureMs();
            kept++;
        }
        report("saturated points excluded (every " + "sample or reference exposure at or near full scale there)", saturated);
        report("points excluded because the reference is not above the dark", noReference);
        if (kept < ParsedSpectrum.MIN_POINTS) {
            throw ImportException.ofSource(source, "only " + kept + " usable points after excluding saturated ones; "
                    + String.join("; ", warnings));
        }
        exposureNote(samples, index, kept);
        ParsedSpectrum spectrum = ParsedSpectrum.of(source, java.util.Arrays.copyOf(x, kept),
                java.util.Arrays.copyOf(t, kept), java.util.Arrays.copyOf(bound, kept), YKind.TRANSMITTANCE_FRACTION,
                raw.xUnit(), metadata(), allWarnings());
        return new RawCountsResult(spectrum, java.util.Arrays.copyOf(limits, kept),
                java.util.Arrays.copyOf(index, kept), java.util.Arrays.copyOf(ms, kept));
    }

    private void buildDarks(List<Capture> darkCaptures) {
        Map<Double, List<Capture>> byExposure = new TreeMap<>();
        for (Capture d : darkCaptures) {
            byExposure.computeIfAbsent(d.exposureMs(), k -> new ArrayList<>()).add(d);
        }
        byExposure.forEach((exposure, group) -> darks.put(exposure, level(exposure, group)));
    }

    private DarkLevel level(double exposure, List<Capture> group) {
        int n = raw.size();
        double[] mean = new double[n];
        double[] sigma = new double[n];
        int scans = group.get(0).scans();
        if (group.stream().anyMatch(c -> c.scans() != scans)) {
            warnings.add("dark captures at " + exposure + " ms average different numbers of scans; "
                    + scans + " (the first) is used for the noise");
        }
        if (group.size() == 1) {
            double[] d = group.get(0).counts();
            int w = options.noiseHalfWindow();
            for (int i = 0; i < n; i++) {
                mean[i] = d[i];
                sigma[i] = stdDev(d, Math.max(0, i - w), Math.min(n, i + w + 1));
            }
            return new DarkLevel(exposure, mean, sigma, scans, "3σ over ±" + w + " neighbouring pixels of one dark capture at "
                    + exposure + " ms");
        }
        int k = group.size();
        for (int i = 0; i < n; i++) {
            double[] v = new double[k];
            for (int j = 0; j < k; j++) {
                v[j] = group.get(j).count(i);
            }
            sigma[i] = stdDev(v, 0, k);
            mean[i] = meanOf(v, 0, k);
        }
        return new DarkLevel(exposure, mean, sigma, scans, "3σ of " + k + " repeated dark captures at " + exposure + " ms");
    }

    static double meanOf(double[] v, int from, int to) {
        double sum = 0;
        for (int i = from; i < to; i++) {
            sum += v[i];
        }
        return sum / (to - from);
    }

    /** Sample standard deviation (n − 1 in the denominator); 0 for a single value. */
    static double stdDev(double[] v, int from, int to) {
        int n = to - from;
        if (n < 2) {
            return 0;
        }
        double mean = meanOf(v, from, to);
        double ss = 0;
        for (int i = from; i < to; i++) {
            ss += (v[i] - mean) * (v[i] - mean);
        }
        return Math.sqrt(ss / (n - 1));
    }

    private DarkLevel darkFor(double exposure) {
        DarkLevel exact = darks.get(exposure);
        if (exact != null) {
            return exact;
        }
        DarkLevel nearest = null;
        for (DarkLevel d : darks.values()) {
            if (nearest == null || Math.abs(d.exposureMs() - exposure) < Math.abs(nearest.exposureMs() - exposure)) {
                nearest = d;
            }
        }
        if (warnedDark.put(exposure, Boolean.TRUE) == null) {
            warnings.add("no dark at " + exposure + " ms: the dark at " + nearest.exposureMs() + " ms is used as it is"
                    + " (this assumes the dark is mostly detector offset; it is exact only at equal exposures)");
        }
        return nearest;
    }

    private boolean[][] saturation(List<Capture> captures) {
        boolean[][] sat = new boolean[captures.size()][];
        for (int c = 0; c < captures.size(); c++) {
            sat[c] = saturated(captures.get(c).counts());
        }
        return sat;
    }

    /** At or above the saturation fraction of full scale, or inside a flat run at the capture's maximum. */
    boolean[] saturated(double[] counts) {
        int n = counts.length;
        boolean[] sat = new boolean[n];
        double full = options.fullScale();
        double max = Double.NEGATIVE_INFINITY;
        for (int i = 0; i < n; i++) {
            max = Math.max(max, counts[i]);
            sat[i] = !Double.isNaN(full) && counts[i] >= options.saturationFraction() * full;
        }
        if (!(max > 0) || !Double.isNaN(full) && max < 0.5 * full) {
            return sat;
        }
        for (int i = 0; i < n; ) {
            int j = i;
            while (j < n && counts[j] == max) {
                j++;
            }
            if (j - i >= options.flatTopRun()) {
                for (int k = i; k < j; k++) {
                    sat[k] = true;
                }
            }
            i = Math.max(j, i + 1);
        }
        return sat;
    }

    private static int longestUnsaturated(List<Capture> captures, boolean[][] sat, int i) {
        int best = -1;
        for (int c = 0; c < captures.size(); c++) {
            if (!sat[c][i] && (best < 0 || captures.get(c).exposureMs() > captures.get(best).exposureMs())) {
                best = c;
            }
        }
        return best;
    }

    private void report(String what, List<Double> wavelengths) {
        if (wavelengths.isEmpty()) {
            return;
        }
        StringBuilder list = new StringBuilder();
        for (int k = 0; k < Math.min(LISTED, wavelengths.size()); k++) {
            list.append(k == 0 ? "" : ", ").append(wavelengths.get(k));
        }
        if (wavelengths.size() > LISTED) {
            list.append(" and ").append(wavelengths.size() - LISTED).append(" more");
        }
        warnings.add(what + ": " + wavelengths.size() + " points at " + list + " nm");
    }

    private void exposureNote(List<Capture> samples, int[] index, int kept) {
        if (samples.size() < 2) {
            return;
        }
        int[] counts = new int[samples.size()];
        for (int k = 0; k < kept; k++) {
            counts[index[k]]++;
        }
        StringBuilder note = new StringBuilder("points per sample exposure:");
        for (int c = 0; c < counts.length; c++) {
            note.append(c == 0 ? " " : ", ").append(samples.get(c).exposureMs()).append(" ms: ").append(counts[c]);
        }
        warnings.add(note.append(" (each point from the longest exposure not saturated there)").toString());
    }

    private Map<String, String> metadata() {
        Map<String, String> m = new LinkedHashMap<>(raw.metadata());
        m.put("provenance", "raw counts");
        List<String> methods = new ArrayList<>();
        darks.values().forEach(d -> methods.add(d.method()));
        m.put("detection_limit_method", String.join("; ", methods) + " (IUPAC L03540, k = 3)");
        m.put("stray_light_floor", Double.toString(options.strayLightFloor()));
        return m;
    }

    private List<String> allWarnings() {
        List<String> all = new ArrayList<>(raw.warnings());
        all.addAll(warnings);
        return all;
    }
}

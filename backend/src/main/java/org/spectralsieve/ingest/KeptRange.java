package org.spectralsieve.ingest;

import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import java.util.Objects;
import java.util.OptionalDouble;

/**
 * Which part of a file's wavelength axis becomes the curve, and why: the whole axis, the {@code from}/{@code to}
 * range the user asked for, or the axis without a {@link NoiseRegion} at its end. The stored original file
 * always stays whole; only the curve is cut, and every point left out is counted in a warning.
 *
 * <p>Each end is decided on its own: an end the user set ({@code from} for the short end, {@code to} for the
 * long end) is kept exactly as asked, even inside a noise region (which is then flagged as kept); an end left
 * blank is cut only where a noise region lies. Noise is left out by default because its readings (T of 537 %
 * or 30 % at neighbouring nanometres in a real diode-array file) would otherwise decide blocking and cutoff
 * verdicts there; left out, those wavelengths are simply not covered, and the verdicts say so.
 *
 * @param fileFromNm   the file's first wavelength
 * @param fileToNm     the file's last wavelength
 * @param filePoints   the file's number of points
 * @param firstIndex   the first point kept (index into the file's axis)
 * @param lastIndex    the last point kept (inclusive)
 * @param keptFromNm   the curve's first wavelength
 * @param keptToNm     the curve's last wavelength
 * @param fromNm       the {@code from} option as given (empty: not given)
 * @param toNm         the {@code to} option as given (empty: not given)
 * @param noiseRegions the noise regions found on the file's whole axis
 * @param suggestedFromNm the {@code from} that leaves the noise regions out (empty when none was found)
 * @param suggestedToNm   the {@code to} that leaves the noise regions out (empty when none was found)
 */
public record KeptRange(double fileFromNm, double fileToNm, int filePoints, int firstIndex, int lastIndex,
                        double keptFromNm, double keptToNm, OptionalDouble fromNm, OptionalDouble toNm,
                        List<NoiseRegion> noiseRegions, OptionalDouble suggestedFromNm,
                        OptionalDouble suggestedToNm) {

    public KeptRange {
        Objects.requireNonNull(fromNm, "fromNm");
        Objects.requireNonNull(toNm, "toNm");
        Objects.requireNonNull(suggestedFromNm, "suggestedFromNm");
        Objects.requireNonNull(suggestedToNm, "suggestedToNm");
        noiseRegions = List.copyOf(noiseRegions);
        if (firstIndex < 0 || lastIndex < firstIndex + 1 || lastIndex >= filePoints) {
            throw new IllegalArgumentException("a kept range needs at least 2 of the file's " + filePoints + " points");
        }
    }

    /** The whole axis, nothing asked for, no noise looked for. */
    public static KeptRange whole(double[] wavelengthsNm) {
        int n = wavelengthsNm.length;
        return new KeptRange(wavelengthsNm[0], wavelengthsNm[n - 1], n, 0, n - 1, wavelengthsNm[0],
                wavelengthsNm[n - 1], OptionalDouble.empty(), OptionalDouble.empty(), List.of(), OptionalDouble.empty(),
                OptionalDouble.empty());
    }

    /**
     * The part to keep of an axis, by the rule in the class comment.
     *
     * @param wavelengthsNm the file's axis, ascending
     * @param regions       the noise regions found on it (none for formats that are not checked)
     * @param options       the {@code from}/{@code to} the user gave
     * @throws ImportRequestException naming {@code from} or {@code to} when fewer than 2 points would remain
     */
    public static KeptRange choose(double[] wavelengthsNm, List<NoiseRegion> regions, ImportOptions options) {
        int n = wavelengthsNm.length;
        OptionalDouble from = options.keepFromNm();
        OptionalDouble to = options.keepToNm();
        NoiseRegion shortEnd = at(regions, NoiseRegion.End.SHORT);
        NoiseRegion longEnd = at(regions, NoiseRegion.End.LONG);
        int first;
        if (from.isPresent()) {
            first = 0;
            while (first < n && wavelengthsNm[first] < from.getAsDouble()) {
                first++;
            }
        } else {
            first = shortEnd == null ? 0 : shortEnd.lastIndex() + 1;
        }
        int last;
        if (to.isPresent()) {
            last = n - 1;
            while (last >= 0 && wavelengthsNm[last] > to.getAsDouble()) {
                last--;
            }
        } else {
            last = longEnd == null ? n - 1 : longEnd.firstIndex() - 1;
        }
        if (last - first + 1 < 2) {
            String parameter = from.isPresent() ? "from" : "to";
            throw new ImportRequestException(parameter, "the range to keep" + asked(from, to) + " leaves "
                    + Math.max(0, last - first + 1) + " of the file's " + n + " points (" + nm(wavelengthsNm[0]) + "–"
                    + nm(wavelengthsNm[n - 1]) + " nm); a curve needs at least 2");
        }
        OptionalDouble suggestedFrom = OptionalDouble.empty();
        OptionalDouble suggestedTo = OptionalDouble.empty();
        if (!regions.isEmpty()) {
            suggestedFrom = OptionalDouble.of(wavelengthsNm[shortEnd == null ? 0 : shortEnd.lastIndex() + 1]);
            suggestedTo = OptionalDouble.of(wavelengthsNm[longEnd == null ? n - 1 : longEnd.firstIndex() - 1]);
        }
        return new KeptRange(wavelengthsNm[0], wavelengthsNm[n - 1], n, first, last, wavelengthsNm[first],
                wavelengthsNm[last], from, to, regions, suggestedFrom, suggestedTo);
    }

    private static NoiseRegion at(List<NoiseRegion> regions, NoiseRegion.End end) {
        return regions.stream().filter(r -> r.end() == end).findFirst().orElse(null);
    }

    private static String asked(OptionalDouble from, OptionalDouble to) {
        return (from.isPresent() ? " from " + nm(from.getAsDouble()) + " nm" : "")
                + (to.isPresent() ? " to " + nm(to.getAsDouble()) + " nm" : "");
    }

    /** True when every point of the file is kept. */
    public boolean isWhole() {
        return firstIndex == 0 && lastIndex == filePoints - 1;
    }

    /** Points left out below the kept range (short wavelengths). */
    public int leftOutBelow() {
        return firstIndex;
    }

    /** Points left out above the kept range (long wavelengths). */
    public int leftOutAbove() {
        return filePoints - 1 - lastIndex;
    }

    /** How many of a region's points are in the kept range. */
    public int keptOf(NoiseRegion r) {
        return Math.max(0, Math.min(lastIndex, r.lastIndex()) - Math.max(firstIndex, r.firstIndex()) + 1);
    }

    /**
     * One warning per end the user set, saying how many points it left out and where, and one per noise region,
     * saying whether it was left out or kept as asked and why it is taken for noise.
     *
     * @param wavelengthsNm the file's axis (for the wavelengths of what was left out)
     */
    public List<String> warnings(double[] wavelengthsNm) {
        List<String> warnings = new ArrayList<>();
        if (fromNm.isPresent()) {
            warnings.add("from " + nm(fromNm.getAsDouble()) + " nm: " + (leftOutBelow() == 0
                    ? "no point left out (the file starts at " + nm(fileFromNm) + " nm)"
                    : points(leftOutBelow()) + " below it left out (" + span(fileFromNm, wavelengthsNm[firstIndex - 1])
                    + "); the stored original file keeps them"));
        }
        if (toNm.isPresent()) {
            warnings.add("to " + nm(toNm.getAsDouble()) + " nm: " + (leftOutAbove() == 0
                    ? "no point left out (the file ends at " + nm(fileToNm) + " nm)"
                    : points(leftOutAbove()) + " above it left out (" + span(wavelengthsNm[lastIndex + 1], fileToNm)
                    + "); the stored original file keeps them"));
        }
        for (NoiseRegion r : noiseRegions) {
            warnings.add(regionWarning(r));
        }
        return warnings;
    }

    private String regionWarning(NoiseRegion r) {
        boolean shortEnd = r.end() == NoiseRegion.End.SHORT;
        String head = "noise region at the " + r.end().label() + "-wavelength end, " + r.range() + " (" + r.points()
                + " points)";
        int kept = keptOf(r);
        String keepIt = shortEnd ? "from=" + nm(fileFromNm) : "to=" + nm(fileToNm);
        if (kept == 0) {
            boolean asked = shortEnd ? fromNm.isPresent() : toNm.isPresent();
            return head + (asked ? ", outside the range asked for" : ", left out") + ": " + r.reason()
                    + (asked ? "" : "; the stored original file keeps these points (import with " + keepIt
                    + " to keep them)");
        }
        String leaveOut = shortEnd ? "from=" + nm(suggestedFromNm.orElse(keptFromNm))
                : "to=" + nm(suggestedToNm.orElse(keptToNm));
        return head + ", " + kept + " of them kept as asked: " + r.reason() + "; verdicts resting on these points rest"
                + " on noise (" + leaveOut + " leaves the region out)";
    }

    private static String points(int n) {
        return n == 1 ? "1 point" : n + " points";
    }

    private static String span(double fromNm, double toNm) {
        return fromNm == toNm ? "at " + nm(fromNm) + " nm" : nm(fromNm) + "–" + nm(toNm) + " nm";
    }

    /** A wavelength as the warnings write it: 190, 254.5. */
    static String nm(double v) {
        return String.format(Locale.ROOT, "%.6g", v).replaceAll("(\\.\\d*?)0+$", "$1").replaceAll("\\.$", "");
    }
}

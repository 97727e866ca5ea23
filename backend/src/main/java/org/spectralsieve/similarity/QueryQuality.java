package org.spectralsieve.similarity;

import java.util.ArrayList;
import java.util.List;

/**
 * What a ranking can rest on, judged from the query alone over the compared band, and the warnings a reader
 * needs before trusting it. A curve that is mostly at its detection floor still gets a ranking (the shape
 * "opaque here" is evidence), but its order is decided by the few resolved points, or by noise lifted just
 * above the floor — the answer must say so rather than name a material with confidence.
 *
 * <p>The rules (our choice, see docs/similar-curves.md):
 * <ul>
 *   <li>floor: more than half the covered points in the band are bounds (at or below the detection limit);</li>
 *   <li>few resolved: fewer than {@link SimilarCurves#MIN_COMMON_POINTS} resolved points (45 nm, about one
 *       absorption edge) even when the bounds are not the majority;</li>
 *   <li>little coverage: the curve has readings at fewer than half the band's grid points.</li>
 * </ul>
 *
 * @param bandPoints     grid points inside the compared band
 * @param coveredPoints  of those, points with a reading (resolved or bound)
 * @param resolvedPoints of those, points resolved (above the detection limit)
 */
public record QueryQuality(ComparedBand band, int bandPoints, int coveredPoints, int resolvedPoints) {

    public QueryQuality {
        if (band == null || coveredPoints < 0 || coveredPoints > bandPoints || resolvedPoints < 0
                || resolvedPoints > coveredPoints) {
            throw new IllegalArgumentException("need 0 <= resolved " + resolvedPoints + " <= covered " + coveredPoints
                    + " <= band points " + bandPoints);
        }
    }

    /** The query's points inside {@code band}. */
    public static QueryQuality of(CurveSignature query, ComparedBand band) {
        int covered = 0;
        int resolved = 0;
        for (int i = 0; i < CurveSignature.DIMENSION; i++) {
            if (!band.holds(i)) {
                continue;
            }
            if (query.weight(i) > 0) {
                covered++;
            }
            if (query.weight(i) == 1) {
                resolved++;
            }
        }
        return new QueryQuality(band, band.gridPoints(), covered, resolved);
    }

    public int boundPoints() {
        return coveredPoints - resolvedPoints;
    }

    /** More than half of the covered points are detection-limit bounds. */
    public boolean mostlyAtFloor() {
        return coveredPoints > 0 && 2 * boundPoints() > coveredPoints;
    }

    public boolean fewResolved() {
        return resolvedPoints < SimilarCurves.MIN_COMMON_POINTS;
    }

    /** Readings at fewer than half the band's grid points. */
    public boolean littleCoverage() {
        return 2 * coveredPoints < bandPoints;
    }

    /** The warnings for the answer, most serious first; empty for a curve that covers the band and is resolved. */
    public List<String> warnings() {
        List<String> out = new ArrayList<>();
        String where = band.wholeGrid() ? band + " (the whole grid)" : "the band " + band;
        if (coveredPoints < SimilarCurves.MIN_COMMON_POINTS) {
            out.add("this curve has readings at only " + coveredPoints + " of the " + bandPoints + " grid points of "
                    + where + "; at least " + SimilarCurves.MIN_COMMON_POINTS + " are needed, so no stored curve"
                    + " can be compared with it");
            return out;
        }
        if (mostlyAtFloor()) {
            out.add("most of this curve is at the detection limit: " + boundPoints() + " of its " + coveredPoints
                    + " points in " + where + " are bounds; the ranking rests on " + resolvedPoints + " resolved points"
                    + (resolvedPoints == 0 ? ", so its order says nothing about the material" : ""));
        } else if (fewResolved()) {
            out.add("only " + resolvedPoints + " of this curve's " + coveredPoints + " points in " + where
                    + " are above the detection limit; the ranking rests on them and says little");
        }
        if (littleCoverage()) {
            out.add("this curve covers only " + coveredPoints + " of the " + bandPoints + " grid points of " + where
                    + "; curves are compared only where both have readings");
        }
        return List.copyOf(out);
    }
}

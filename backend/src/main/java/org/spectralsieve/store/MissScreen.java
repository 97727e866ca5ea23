package org.spectralsieve.store;

import java.util.ArrayList;
import java.util.Arrays;
import java.util.List;
import java.util.stream.IntStream;
import org.spectralsieve.requirement.Aggregate;
import org.spectralsieve.requirement.Direction;
import org.spectralsieve.requirement.TransmittanceClause;

/**
 * What the store can prove on its own: that a curve, as measured, misses an every-point transmittance
 * clause somewhere inside the band. For requirements the store cannot rank (weighted figures, a fixed
 * layer) this rules samples out soundly, leaving the exact evaluator to judge the rest.
 *
 * <p>For each clause and curve: the lowest margin, in decades, of a grid reading inside the band that is
 * measured and not below detection. Why a negative one is a proof, for the exact evaluator on the stored
 * curve: the store's value at a grid wavelength is the curve's own absorbance interpolation there,
 * quantized to within {@link #SLACK_DECADES}; between stored points absorbance is a straight line, so
 * some reading the exact evaluator takes (a stored point inside the band or a band end, and not below
 * detection, because the grid reading is not) is at least as dark for a pass (at least as bright for a
 * block). So the exact clause margin is at most the store's plus the slack. A reading above T = 1
 * (noise) is stored as T = 1, which can only raise a pass margin and lower a block margin: never a false
 * proof. Readings flagged as bounds, band ends between grid points, and means prove nothing here.
 */
public final class MissScreen {

    /** Quantization of {@link OdCode} (half a step) with room for rounding: added to every margin read. */
    public static final double SLACK_DECADES = OdCode.STEP;

    private static final int CHUNK = 4096;

    private MissScreen() {
    }

    /**
     * @return margins[clause][curve]: the lowest margin of an unbounded grid reading inside the band, as
     *         measured, plus {@link #SLACK_DECADES} — an upper bound on the exact clause margin of that curve
     *         as measured; +∞ when the band holds no such reading
     * @throws IllegalArgumentException for a mean, which this screen cannot bound
     */
    public static double[][] marginBounds(SpectralStore store, List<TransmittanceClause> clauses) {
        double[][] out = new double[clauses.size()][];
        for (int c = 0; c < clauses.size(); c++) {
            TransmittanceClause clause = clauses.get(c);
            if (clause.aggregate() != Aggregate.EVERY_POINT) {
                throw new IllegalArgumentException("the miss screen bounds every-point clauses only, not '"
                        + clause.text() + "'");
            }
            out[c] = marginBounds(store, clause);
        }
        return out;
    }

    private static double[] marginBounds(SpectralStore store, TransmittanceClause clause) {
        int[] columns = columnsInside(store, clause.band().fromNm(), clause.band().toNm());
        double thresholdOd = -Math.log10(clause.thresholdT());
        boolean pass = clause.direction() == Direction.PASS;
        int n = store.size();
        double[] lowest = new double[n];
        Arrays.fill(lowest, Double.POSITIVE_INFINITY);
        int chunks = (n + CHUNK - 1) / CHUNK;
        IntStream.range(0, chunks).parallel().forEach(k -> {
            int from = k * CHUNK;
            int to = Math.min(n, from + CHUNK);
            for (int w : columns) {
                short[] column = store.column(w);
                for (int curve = from; curve < to; curve++) {
                    short code = column[curve];
                    if (!OdCode.isMeasured(code) || OdCode.isBound(code)) {
                        continue;
                    }
                    double od = OdCode.opticalDensity(code);
                    double margin = pass ? thresholdOd - od : od - thresholdOd;
                    if (margin < lowest[curve]) {
                        lowest[curve] = margin;
                    }
                }
            }
            for (int curve = from; curve < to; curve++) {
                lowest[curve] += SLACK_DECADES;
            }
        });
        return lowest;
    }

    /** Grid columns whose wavelength lies within [from, to]. */
    private static int[] columnsInside(SpectralStore store, double fromNm, double toNm) {
        List<Integer> inside = new ArrayList<>();
        for (int w = 0; w < store.gridSize(); w++) {
            double nm = store.gridNm(w);
            if (nm >= fromNm && nm <= toNm) {
                inside.add(w);
            }
        }
        return inside.stream().mapToInt(Integer::intValue).toArray();
    }
}

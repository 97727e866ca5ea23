package org.spectralsieve.store;

import java.util.ArrayList;
import java.util.Arrays;
import java.util.List;
import java.util.stream.IntStream;
import org.spectralsieve.optics.Fresnel;
import org.spectralsieve.optics.Slab;
import org.spectralsieve.optics.SlabReading;
import org.spectralsieve.requirement.Clause;
import org.spectralsieve.requirement.MadeThicknesses;
import org.spectralsieve.requirement.MaterialJudge;
import org.spectralsieve.requirement.NominalThickness;
import org.spectralsieve.requirement.SampleEvaluator;
import org.spectralsieve.requirement.ThicknessInterval;
import org.spectralsieve.requirement.Requirement;
import org.spectralsieve.requirement.ThicknessSpec;

/** The requirement compiled against one store: probes located, surface losses per index model tabulated. */
final class SearchPlan {
    final List<CompiledClause> clauses;
    final ThicknessSpec thickness;
    final String materialClass;
    final Boolean totalGeometry;
    /** surfaceLoss[model][clause][probe] in decades. */
    final double[][][] surfaceLoss;
    /**
     * unresolvedOd[model][clause][probe]: the OD of C − u (lossless ceiling less the reading uncertainty,
     * {@link SlabReading}); a reading at or below it shows no absorption the data can resolve.
     */
    final double[][][] unresolvedOd;
    /** The probes the first pass reads, in the order the curve model adds them, and their losses per model. */
    final List<PointProbe> pointProbes;
    final double[][] pointProbeLoss;
    /**
     * Per curve, the thicknesses it is judged over ({@link MaterialJudge#spans}, cut to the asked range
     * and the made thicknesses for a range), null when its material's nearer samples speak instead;
     * null as a whole when every curve is judged (as measured).
     */
    ThicknessInterval[] spans;
    /**
     * Spans worked out on demand, material by material (over a range a curve that speaks alone), for the
     * curves a column-first pass reads ({@link ColumnFirstScan}): at a million curves the spans of every curve
     * cost more than the rest of that pass. Used while {@link #spans} is null and the thickness is asked; a curve not judged holds
     * {@link #NOT_JUDGED_SPAN}, one not yet worked out null. An array by curve, not a map: at a million
     * curves the map's boxing and growth were half of a thickness-solved column-first pass (JFR profile,
     * docs/store-scan.md). The halves of a column-first pass fill it from two threads: both may work out a
     * material straddling their split, and write the same spans; an element read is null or a record whose
     * fields are final, so a reader sees a whole span or works it out itself.
     */
    private ThicknessInterval[] spansOnDemand;
    private static final ThicknessInterval NOT_JUDGED_SPAN = new ThicknessInterval(1, 1); // compared by identity
    private SpectralStore spanStore;
    /**
     * Spans on demand from the store's flat {@link MaterialTable} (true) or, as the sixth pass did, from each
     * material's curve array and object (false: {@code SearchBenchmark}'s side by side only; same spans).
     */
    boolean spansByTable = true;
    private MaterialTable materialTable;
    final double[][] pointProbeUnresolvedOd;
    /** Whether this plan serves the reference path (the earlier scan, kept for comparison). */
    boolean reference;
    /** From this many curves on, the scan and the spans run in parallel. */
    int parallelMinCurves = StoreSearch.PARALLEL_MIN_CURVES;
    /** From this many curves on, a search judged as measured reads one column first ({@link ColumnFirstScan}). */
    int columnFirstMinCurves = StoreSearch.COLUMN_FIRST_MIN_CURVES;

    private SearchPlan(List<CompiledClause> clauses, ThicknessSpec thickness, String materialClass, Boolean total,
                 double[][][] surfaceLoss, double[][][] unresolvedOd) {
        this.unresolvedOd = unresolvedOd;
        this.clauses = clauses;
        this.thickness = thickness;
        this.materialClass = materialClass;
        this.totalGeometry = total;
        this.surfaceLoss = surfaceLoss;
        List<PointProbe> probes = new ArrayList<>();
        List<int[]> lossIndex = new ArrayList<>();
        for (int c = 0; c < clauses.size(); c++) {
            CompiledClause clause = clauses.get(c);
            List<Probe> p = clause.probes();
            switch (clause.kind()) {
                case EVERY_POINT_PASS, EVERY_POINT_BLOCK -> {
                    boolean pass = clause.kind() == CompiledClause.Kind.EVERY_POINT_PASS;
                    probes.add(new PointProbe(p.get(0), clause.thresholdOd(), pass));
                    lossIndex.add(new int[] {c, 0});
                    if (p.size() > 1) {
                        probes.add(new PointProbe(p.get(p.size() - 1), clause.thresholdOd(), pass));
                        lossIndex.add(new int[] {c, p.size() - 1});
                    }
                }
                case CUTOFF -> {
                    probes.add(new PointProbe(p.get(0), clause.thresholdOd(), false));
                    lossIndex.add(new int[] {c, 0});
                    probes.add(new PointProbe(p.get(1), clause.thresholdOd(), true));
                    lossIndex.add(new int[] {c, 1});
                }
                default -> { } // means are left to the full evaluation
            }
        }
        this.pointProbes = List.copyOf(probes);
        this.pointProbeLoss = new double[surfaceLoss.length][probes.size()];
        this.pointProbeUnresolvedOd = new double[surfaceLoss.length][probes.size()];
        for (int model = 0; model < surfaceLoss.length; model++) {
            for (int k = 0; k < probes.size(); k++) {
                pointProbeLoss[model][k] = surfaceLoss[model][lossIndex.get(k)[0]][lossIndex.get(k)[1]];
                pointProbeUnresolvedOd[model][k] = unresolvedOd[model][lossIndex.get(k)[0]][lossIndex.get(k)[1]];
            }
        }
    }

    static SearchPlan of(SpectralStore store, Requirement r, boolean reference, int parallelMinCurves) {
        if (!r.plain()) {
            throw new IllegalArgumentException("the store ranks transmittance and cutoff clauses on the candidate"
                    + " alone; '" + r.text() + "' has weighted clauses or a fixed layer (see MissScreen)");
        }
        List<CompiledClause> clauses = new ArrayList<>();
        for (Clause clause : r.clauses()) {
            clauses.add(CompiledClause.compile(store, clause));
        }
        double[][][] loss = new double[store.indexModelCount()][clauses.size()][];
        double[][][] unresolved = new double[store.indexModelCount()][clauses.size()][];
        for (int model = 0; model < loss.length; model++) {
            for (int c = 0; c < clauses.size(); c++) {
                List<Probe> probes = clauses.get(c).probes();
                loss[model][c] = new double[probes.size()];
                unresolved[model][c] = new double[probes.size()];
                for (int p = 0; p < probes.size(); p++) {
                    double reflectance = Fresnel.reflectanceInAir(store.indexModel(model).at(probes.get(p).nm()));
                    loss[model][c][p] = -2 * Math.log10(1 - reflectance);
                    unresolved[model][c][p] = -Math.log10(
                            Slab.losslessTransmittance(reflectance) - SlabReading.READING_UNCERTAINTY);
                }
            }
        }
        // null admits both geometries: no filter, or "geometry any"
        Boolean total = r.admitsGeometry("regular") && r.admitsGeometry("total") ? null : !r.admitsGeometry("regular");
        SearchPlan plan = new SearchPlan(List.copyOf(clauses), r.thickness(), r.materialClass().orElse(null), total, loss,
                unresolved);
        plan.reference = reference;
        plan.parallelMinCurves = parallelMinCurves;
        plan.spanStore = store;
        // the reworked scan works spans out when it knows its path: all of them for the chunk scan
        // (allSpans), only those of the curves it reads for the column-first pass (spanOf)
        plan.spans = reference ? plan.spans(store) : null;
        if (!reference && r.thickness().kind() != ThicknessSpec.Kind.AS_MEASURED) {
            plan.spansOnDemand = new ThicknessInterval[store.size()];
        }
        return plan;
    }

    /** Every curve's span, in parallel on a large store: what the chunk scan reads. */
    void allSpans() {
        if (spans == null && thickness.kind() != ThicknessSpec.Kind.AS_MEASURED) {
            spans = spansInParallel(spanStore);
        }
    }

    /** A curve's judged span, null when it is not judged; worked out for its material on first use. */
    ThicknessInterval spanOf(int curve) {
        if (spans != null) {
            return spans[curve];
        }
        ThicknessInterval known = spansOnDemand[curve];
        if (known == null) {
            known = spansByTable ? spanOfMaterialFromTable(curve) : spanOfMaterialFromObjects(curve);
        }
        return known == NOT_JUDGED_SPAN ? null : known;
    }

    /**
     * Works out the spans of the curve's material from the store's flat {@link MaterialTable} and records
     * them; the curve's own (or {@link #NOT_JUDGED_SPAN}). The same spans as
     * {@link #spanOfMaterialFromObjects}: the same curves in the same order, the same made thicknesses.
     */
    private ThicknessInterval spanOfMaterialFromTable(int curve) {
        MaterialTable table = materialTable;
        if (table == null) {
            table = spanStore.materialTable();
            materialTable = table; // the halves of a pass may both fetch it: the store's one table either way
        }
        int m = spanStore.materialIndex(curve);
        int from = table.start()[m];
        int to = table.start()[m + 1];
        int[] curves = table.curves();
        ThicknessInterval alone = speakingSpanOverRangeAllAdmitted(spanStore, curves, from, to, table.made()[m],
                curve);
        if (alone != null) {
            // it speaks, so its span is settled whatever its material's other curves say; theirs wait until asked
            spansOnDemand[curve] = alone;
            return alone;
        }
        ThicknessInterval[] own = spansOverRangeAllAdmitted(spanStore, curves, from, to, table.made()[m]);
        if (own == null) {
            own = spansOfCurves(spanStore, curves, from, to, table.made()[m]);
        }
        ThicknessInterval known = null;
        for (int i = from; i < to; i++) {
            ThicknessInterval span = own[i - from] == null ? NOT_JUDGED_SPAN : own[i - from];
            spansOnDemand[curves[i]] = span;
            if (curves[i] == curve) {
                known = span;
            }
        }
        return known;
    }

    /**
     * Over a range with no filter, the spans of {@link #spansOfCurves} ({@link MaterialJudge#spans}, then
     * {@link #judgedRange}) worked out in one loop: the same rule on the same doubles, but the made thicknesses
     * inside the range are asked once per material (a pure function of the range) rather than twice per curve,
     * and no intermediate arrays or intervals are made. About twenty small objects per material were most of
     * the spans' time at a million curves. Null where this does not apply, and the general path runs: a
     * filter, a curve of unknown thickness, or no curve speaking inside the range (MaterialJudge then names
     * the nearest samples).
     */
    private ThicknessInterval[] spansOverRangeAllAdmitted(SpectralStore store, int[] curves, int from, int to,
                                                          MadeThicknesses made) {
        if (thickness.kind() != ThicknessSpec.Kind.RANGE || totalGeometry != null || materialClass != null) {
            return null;
        }
        int length = to - from;
        double[] known = new double[length];
        for (int i = 0; i < length; i++) {
            known[i] = store.thicknessMm(curves[from + i]);
            if (Double.isNaN(known[i])) {
                return null;
            }
        }
        double min = thickness.minMm();
        double max = thickness.maxMm();
        boolean bulk = store.isBulk(curves[from]);
        ThicknessInterval inMade = made.within(min, max);
        ThicknessInterval[] out = new ThicknessInterval[length];
        boolean any = false;
        for (int i = 0; i < length; i++) {
            out[i] = speakingSpan(known, i, bulk, made, inMade, min, max);
            any |= out[i] != null;
        }
        return any ? out : null;
    }

    /**
     * As {@link #spansOverRangeAllAdmitted}, for one curve of the material: its judged span when it speaks
     * inside the range (then nothing the other curves say changes it), null when it does not or the fast path
     * does not apply (the whole material is then worked out).
     */
    private ThicknessInterval speakingSpanOverRangeAllAdmitted(SpectralStore store, int[] curves, int from, int to,
                                                               MadeThicknesses made, int curve) {
        if (thickness.kind() != ThicknessSpec.Kind.RANGE || totalGeometry != null || materialClass != null) {
            return null;
        }
        int length = to - from;
        double[] known = new double[length];
        int self = -1;
        for (int i = 0; i < length; i++) {
            known[i] = store.thicknessMm(curves[from + i]);
            if (Double.isNaN(known[i])) {
                return null;
            }
            self = curves[from + i] == curve ? i : self;
        }
        double min = thickness.minMm();
        double max = thickness.maxMm();
        return speakingSpan(known, self, store.isBulk(curves[from]), made, made.within(min, max), min, max);
    }

    /**
     * {@link MaterialJudge#spans}' rule for the sample of thickness {@code known[i]} over the asked range (the
     * material's made part of it {@code inMade}), then {@link #judgedRange}: its judged span, null when it
     * does not speak inside the range.
     */
    private static ThicknessInterval speakingSpan(double[] known, int i, boolean bulk, MadeThicknesses made,
                                                  ThicknessInterval inMade, double min, double max) {
        ThicknessInterval span = MaterialJudge.span(known[i], known);
        double lo = inMade == null ? Double.NaN : Math.max(inMade.loMm(), span.loMm());
        double hi = inMade == null ? Double.NaN : Math.min(inMade.hiMm(), span.hiMm());
        boolean speaks = bulk
                ? inMade != null && lo <= hi && (made.continuous() || !made.stockWithin(lo, hi).isEmpty())
                : NominalThickness.within(known[i], min, max);
        if (!speaks) {
            return null;
        }
        // judgedRange: the span cut to the range's made part, the span itself when that is empty
        return inMade != null && lo <= hi ? new ThicknessInterval(lo, hi) : span;
    }

    /** As {@link #spanOfMaterialFromTable}, by the material's curve array and object (the sixth pass's way). */
    private ThicknessInterval spanOfMaterialFromObjects(int curve) {
        int[] curves = spanStore.curvesByMaterial()[spanStore.materialIndex(curve)];
        ThicknessInterval[] own = spansOfCurves(spanStore, curves);
        ThicknessInterval known = null;
        for (int i = 0; i < curves.length; i++) {
            ThicknessInterval span = own[i] == null ? NOT_JUDGED_SPAN : own[i];
            spansOnDemand[curves[i]] = span;
            if (curves[i] == curve) {
                known = span;
            }
        }
        return known;
    }

    /** The judged span of every curve, material by material among its admitted curves (as {@link MaterialJudge}). */
    private ThicknessInterval[] spans(SpectralStore store) {
        if (thickness.kind() == ThicknessSpec.Kind.AS_MEASURED) {
            return null;
        }
        ThicknessInterval[] out = new ThicknessInterval[store.size()];
        for (int[] curves : store.curvesByMaterial()) {
            int[] admitted = java.util.Arrays.stream(curves).filter(c -> admits(store, c)).toArray();
            if (admitted.length == 0) {
                continue;
            }
            double[] mm = java.util.Arrays.stream(admitted).mapToDouble(store::thicknessMm).toArray();
            MadeThicknesses made = store.material(admitted[0]).made();
            ThicknessInterval[] spans = MaterialJudge.spans(mm, store.isBulk(admitted[0]), made, thickness);
            for (int i = 0; i < admitted.length; i++) {
                out[admitted[i]] = spans[i] == null ? null : judgedRange(spans[i], made);
            }
        }
        return out;
    }

    /**
     * The same spans as {@link #spans}, material by material in parallel on a large store, with plain loops:
     * the streams per material were most of a thickness-solved search's time at a million curves.
     */
    private ThicknessInterval[] spansInParallel(SpectralStore store) {
        if (thickness.kind() == ThicknessSpec.Kind.AS_MEASURED) {
            return null;
        }
        ThicknessInterval[] out = new ThicknessInterval[store.size()];
        int[][] byMaterial = store.curvesByMaterial();
        IntStream materials = IntStream.range(0, byMaterial.length);
        if (store.size() >= parallelMinCurves) {
            materials = materials.parallel();
        }
        materials.forEach(m -> spansOfMaterial(store, byMaterial[m], out));
        return out;
    }

    private void spansOfMaterial(SpectralStore store, int[] curves, ThicknessInterval[] out) {
        ThicknessInterval[] own = spansOfCurves(store, curves);
        for (int i = 0; i < curves.length; i++) {
            if (own[i] != null) {
                out[curves[i]] = own[i];
            }
        }
    }

    /** The spans of one material's curves, aligned with {@code curves}; null where a curve is not judged. */
    private ThicknessInterval[] spansOfCurves(SpectralStore store, int[] curves) {
        return curves.length == 0 ? new ThicknessInterval[0]
                : spansOfCurves(store, curves, 0, curves.length, store.material(curves[0]).made());
    }

    /**
     * The spans of one material's curves {@code curves[from..to)}, aligned with them; null where a curve is
     * not judged. {@code made}: the material's made thicknesses.
     */
    private ThicknessInterval[] spansOfCurves(SpectralStore store, int[] curves, int from, int to,
                                              MadeThicknesses made) {
        int length = to - from;
        ThicknessInterval[] out = new ThicknessInterval[length];
        int admittedCount = 0;
        int[] position = new int[length];
        int[] admitted = new int[length];
        for (int i = 0; i < length; i++) {
            if (admits(store, curves[from + i])) {
                position[admittedCount] = i;
                admitted[admittedCount++] = curves[from + i];
            }
        }
        if (admittedCount == 0) {
            return out;
        }
        double[] mm = new double[admittedCount];
        for (int i = 0; i < admittedCount; i++) {
            mm[i] = store.thicknessMm(admitted[i]);
        }
        ThicknessInterval[] spans = MaterialJudge.spans(mm, store.isBulk(admitted[0]), made, thickness);
        for (int i = 0; i < admittedCount; i++) {
            out[position[i]] = spans[i] == null ? null : judgedRange(spans[i], made);
        }
        return out;
    }

    /** For a range: the part of the span inside the asked range and the made thicknesses (the span itself when empty). */
    private ThicknessInterval judgedRange(ThicknessInterval span, MadeThicknesses made) {
        if (thickness.kind() != ThicknessSpec.Kind.RANGE) {
            return span;
        }
        ThicknessInterval inMade = made.within(thickness.minMm(), thickness.maxMm());
        if (inMade == null) {
            return span;
        }
        double lo = Math.max(inMade.loMm(), span.loMm());
        double hi = Math.min(inMade.hiMm(), span.hiMm());
        return lo <= hi ? new ThicknessInterval(lo, hi) : span;
    }

    boolean judged(int curve) {
        return thickness.kind() == ThicknessSpec.Kind.AS_MEASURED || spanOf(curve) != null;
    }

    /** The thickness range a curve is solved over: the asked range cut to its span and the made thicknesses. */
    double[] rangeOf(int curve) {
        ThicknessInterval s = thickness.kind() == ThicknessSpec.Kind.AS_MEASURED ? null : spanOf(curve);
        return s == null || s == SampleEvaluator.WHOLE_AXIS ? new double[] {thickness.minMm(), thickness.maxMm()}
                : new double[] {Math.max(thickness.minMm(), s.loMm()), Math.min(thickness.maxMm(), s.hiMm())};
    }

    /** Whether a curve at one asked thickness d is read rescaled (bulk, not measured at d). */
    boolean rescaledAt(SpectralStore store, int curve) {
        return thickness.kind() == ThicknessSpec.Kind.FIXED && store.isBulk(curve)
                && !NominalThickness.same(store.thicknessMm(curve), thickness.minMm());
    }

    /** Whether a curve can be judged at thickness d: measured there, or bulk and made there. */
    boolean judgeableAt(SpectralStore store, int curve, double d) {
        double d0 = store.thicknessMm(curve);
        if (NominalThickness.same(d0, d)) {
            return true;
        }
        return store.isBulk(curve) && store.material(curve).made().makes(d);
    }

    /** Whether a range can be judged for the curve's material at all (bulk: made inside it). */
    boolean rangeJudgeable(SpectralStore store, int curve) {
        if (!store.isBulk(curve)) {
            return NominalThickness.within(store.thicknessMm(curve), thickness.minMm(), thickness.maxMm());
        }
        return store.material(curve).made().within(thickness.minMm(), thickness.maxMm()) != null;
    }

    /**
     * The far thickness ({@link SlabReading#farMm}) of a reading of OD {@code od0} at {@code d0} on a part
     * whose two surfaces lose {@code surfaceLoss} decades: the exact model's rule, on the store's value.
     */
    static double farMm(double od0, double surfaceLoss, double d0) {
        double reflectance = 1 - Math.pow(10, -surfaceLoss / 2);
        return SlabReading.of(Math.pow(10, -od0), reflectance).farMm(d0);
    }

    /** {@link #farMm} divided by d0: the factor alone ({@link SlabReading#farFactor}), the same double. */
    static double farFactor(double od0, double surfaceLoss) {
        double reflectance = 1 - Math.pow(10, -surfaceLoss / 2);
        return SlabReading.of(Math.pow(10, -od0), reflectance).farFactor();
    }

    boolean admits(SpectralStore store, int curve) {
        if (totalGeometry != null && store.isTotalGeometry(curve) != totalGeometry) {
            return false;
        }
        return materialClass == null || store.material(curve).materialClass().equals(materialClass);
    }

}

package org.spectralsieve.search;

import java.util.ArrayList;
import java.util.Arrays;
import java.util.HashMap;
import java.util.List;
import java.util.Map;
import java.util.Optional;
import org.spectralsieve.library.Material;
import org.spectralsieve.library.SampleInfo;
import org.spectralsieve.library.SampleRescaling;
import org.spectralsieve.requirement.Aggregate;
import org.spectralsieve.requirement.Direction;
import org.spectralsieve.requirement.NominalThickness;
import org.spectralsieve.requirement.Requirement;
import org.spectralsieve.requirement.StackLayer;
import org.spectralsieve.requirement.ThicknessSpec;
import org.spectralsieve.requirement.TransmittanceClause;
import org.spectralsieve.store.LayerBlockScreen;
import org.spectralsieve.store.MissScreen;
import org.spectralsieve.store.SpectralStore;

/**
 * A search's first bounds from the store's screens, before any curve is read ({@link FirstBounds}): the every-point
 * screen's proven misses ({@link MissScreen}), the blocks behind a fixed layer ({@link LayerBlockScreen}) and the
 * weighted screen's bounds of either sign ({@link WeightedMisses}), kept by the store's row or, the way before, by
 * sample id. A sample whose stored record fails today's checks gets no bound.
 *
 * <p>Requirements the store cannot rank — weighted figures, a critical wavelength, a fixed layer — are
 * judged exactly on every admitted sample, except samples the store proves to miss ({@link MissScreen}):
 * those are judged only while their bound could still reach the shortlist; and a material whose bound on a
 * met row's margin is below the margins of a shortlist already full of met rows is not judged at all
 * ({@link BoundedJudgement}, docs/weighted-screening.md, "Bounds that rank"). The screen uses the
 * requirement's every-point transmittance clauses that remain necessary conditions on the candidate
 * alone: without a layer, all of them (they are judged on the same curve); with a layer, only the passes,
 * and only over bands inside the layer's range, because a layer can only lower T (the stack's T is at most
 * each part's, T₁T₂/(1 − R₁R₂) ≤ T₁ since T₂ + R₂ ≤ 1), so a candidate too dark alone is too dark in the
 * stack, while one too bright alone may be dark enough behind the layer. Thickness keeps the proof where
 * T can only fall: a pass judged at or above the measured thickness, a block at or below it, any clause on
 * a sample measured at the asked thickness; and a material is held back only where the asked thickness can
 * be made for it (elsewhere its row is unverified, which ranks above a miss).
 */
final class FirstBoundScreens {

    /** Whether weighted clauses are screened by the store ({@link WeightedScreen}); off only to measure it. */
    boolean screenWeighted = true;
    /** Whether the weighted screen uses its earlier, weaker rule ({@link WeightedMisses#addEarlier}); benchmarks only. */
    boolean earlierWeightedScreen;
    /**
     * Whether blocks behind a fixed layer are screened ({@link LayerBlockScreen}); the system property
     * {@code sieve.search.layer-block-screen=false} turns it off, only so a benchmark can time both ways.
     */
    final boolean screenLayerBlocks = !"false".equals(System.getProperty("sieve.search.layer-block-screen"));
    /**
     * Whether weighted blocks behind a fixed layer are bounded ({@code WeightedScreen.Query#behindLayer}); off
     * only so a benchmark can time the rule before them side by side ({@link SearchService#withEarlierLayerBounds}).
     */
    boolean weightedLayerBlocks = true;
    /**
     * Whether {@link #boundsByRow} reads the weighted screen's array in place where no other screen bounded anything
     * ({@link FirstBounds#screenAlone}); off: copied into the two arrays of {@link FirstBounds#byRow}, the eleventh
     * pass's way ({@code -Dsieve.search.slot-sweep=false}, with the slot sweep: {@link SearchService#withSlotSweep});
     * the same values either way.
     */
    boolean screenAloneInPlace = !"false".equals(System.getProperty("sieve.search.slot-sweep"));
    /**
     * Whether a solve over a range without a layer, its weighted screen alone read in place, leaves the bins unread
     * where the figure codes prove no miss ({@link WeightedMisses#screenWithBinsDeferred}; the caller reads in full
     * the rows of every contender it forms, {@link FirstBounds#deferredBins}); {@code -Dsieve.search.deferred-bins=false}
     * reads every curve's bins, the pass before, only so a benchmark can time both ways (the same answers;
     * docs/weighted-screening.md, "Wired into the service").
     */
    boolean deferredBins = !"false".equals(System.getProperty("sieve.search.deferred-bins"));
    /**
     * Curves from which a solve defers its bins: below it the screen is cheap and reading the waiting curves' bins a
     * second time, with their per-range tables formed again per search, cost as much as it saved (the demo library and
     * 10k, docs/benchmarks.md, "Service weighted solve with deferred bins"); 0 with {@link SearchService#withDeferredBins}.
     */
    int deferredBinsFrom = DEFERRED_BINS_FROM;
    static final int DEFERRED_BINS_FROM = 100_000;

    /**
     * The search's first bounds kept in maps keyed by sample id, the way before the eleventh pass
     * ({@code -Dsieve.search.row-arrays=false}): the same values as {@link #boundsByRow}.
     *
     * @param second receives the weighted screen's second stage, when it ran
     */
    FirstBounds boundsBySampleId(Snapshot s, Requirement requirement, Optional<StackLayer> layer,
                                         boolean diffuseLayer, WeightedMisses.SecondStage[] second) {
        Map<Long, Double> provenMiss = provenMisses(s, requirement, layer);
        if (screenLayerBlocks) {
            layer.ifPresent(l -> addLayerBlockMisses(provenMiss, s.store(), requirement, l));
        }
        // an upper bound on each sample's margin of either sign, for rows that meet (WeightedMisses#marginBounds)
        Map<Long, Double> marginBound = new HashMap<>();
        // the store row of each sample with a bound, for the second stage (only those: it only tightens a bound)
        Map<Long, Integer> rowOf = new HashMap<>();
        if (screenWeighted && earlierWeightedScreen) {
            WeightedMisses.addEarlier(provenMiss, s.store(), requirement, layer, diffuseLayer);
        } else if (screenWeighted) {
            WeightedMisses.Screen screen = WeightedMisses.screen(s.store(), requirement, layer, diffuseLayer, weightedLayerBlocks);
            second[0] = screen.secondStage();
            double[] bounds = screen.bounds();
            for (int curve = 0; curve < bounds.length; curve++) {
                if (bounds[curve] < 0) {
                    provenMiss.merge(s.store().sampleId(curve), bounds[curve], Math::min);
                }
                if (bounds[curve] < Double.POSITIVE_INFINITY) {
                    marginBound.merge(s.store().sampleId(curve), bounds[curve], Math::min);
                    rowOf.put(s.store().sampleId(curve), curve);
                }
            }
        }
        // a sample whose stored record fails today's checks is held in the store at a thickness and index it can
        // hold, not its own, so no screen's bound speaks for its exact row (UnusableRecordIsNeverHiddenTest)
        s.unusable().forEach(id -> {
            provenMiss.remove(id);
            marginBound.remove(id);
            rowOf.remove(id);
        });
        return FirstBounds.bySampleId(provenMiss, marginBound, rowOf);
    }

    /**
     * The search's first bounds in arrays indexed by the store's row, filled in the store's row order from the same
     * screens as {@link #boundsBySampleId} (a store holds each sample once, so a row's bounds are its sample's):
     * no boxed entry per sample (docs/weighted-screening.md, "The service at a million curves").
     *
     * @param second receives the weighted screen's second stage, when it ran
     */
    FirstBounds boundsByRow(Snapshot s, Requirement requirement, Optional<StackLayer> layer,
                                    boolean diffuseLayer, WeightedMisses.SecondStage[] second) {
        if (screenAloneInPlace && screenWeighted && !earlierWeightedScreen) {
            return boundsInPlace(s, requirement, layer, diffuseLayer, second);
        }
        return boundsCopiedByRow(s, requirement, layer, diffuseLayer, second);
    }

    /**
     * {@link #boundsByRow} where the weighted screen runs: the every-point and layer-block screens first, into a
     * proven-miss array formed only when one of them bounds a row; when none did, the weighted screen's own array read
     * in place ({@link FirstBounds#screenAlone}), else the same two arrays as {@link #boundsCopiedByRow} with the same
     * values (the minimum of the same bounds, taken in the same order).
     */
    private FirstBounds boundsInPlace(Snapshot s, Requirement requirement, Optional<StackLayer> layer,
                                      boolean diffuseLayer, WeightedMisses.SecondStage[] second) {
        SpectralStore store = s.store();
        double[][] missOrNull = new double[1][];
        RowBound lower = (curve, bound) -> {
            double[] miss = missOrNull[0];
            if (miss == null) {
                miss = new double[store.size()];
                Arrays.fill(miss, Double.NaN);
                missOrNull[0] = miss;
            }
            miss[curve] = Double.isNaN(miss[curve]) ? bound : Math.min(miss[curve], bound);
        };
        provenMisses(s, requirement, layer, lower);
        if (screenLayerBlocks) {
            layer.ifPresent(l -> addLayerBlockMisses(store, requirement, l, lower));
        }
        boolean deferring = deferredBins && store.size() >= deferredBinsFrom && layer.isEmpty() && missOrNull[0] == null
                && requirement.thickness().kind() == ThicknessSpec.Kind.RANGE;
        WeightedMisses.DeferredBins deferredScreen = deferring ? WeightedMisses.screenWithBinsDeferred(store, requirement) : null;
        WeightedMisses.Screen screen = deferring ? null
                : WeightedMisses.screen(store, requirement, layer, diffuseLayer, weightedLayerBlocks);
        second[0] = deferring ? deferredScreen.secondStage() : screen.secondStage();
        double[] bounds = deferring ? deferredScreen.bounds() : screen.bounds();
        int[] unusableRows = unusableRows(s);
        if (missOrNull[0] == null && bounds.length == store.size()) {
            return deferring ? FirstBounds.screenAlone(deferredScreen, unusableRows)
                    : FirstBounds.screenAlone(bounds, unusableRows);
        }
        double[] miss = missOrNull[0];
        if (miss == null) {
            miss = new double[store.size()];
            Arrays.fill(miss, Double.NaN);
        }
        double[] margin = new double[store.size()];
        Arrays.fill(margin, Double.NaN);
        int margins = 0;
        for (int curve = 0; curve < bounds.length; curve++) {
            double b = bounds[curve];
            if (b < 0) {
                miss[curve] = Double.isNaN(miss[curve]) ? b : Math.min(miss[curve], b);
            }
            if (b < Double.POSITIVE_INFINITY) {
                margin[curve] = b;
            }
        }
        for (int row : unusableRows) {
            miss[row] = Double.NaN;
            margin[row] = Double.NaN;
        }
        for (double b : margin) {
            margins += Double.isNaN(b) ? 0 : 1;
        }
        return FirstBounds.byRow(miss, margin, margins);
    }

    /** The store rows of the snapshot's samples whose records fail today's checks (no screen's bound speaks for them). */
    private static int[] unusableRows(Snapshot s) {
        int[] rows = new int[s.unusable().size()];
        int n = 0;
        for (long id : s.unusable()) {
            SampleInfo sample = s.samples().get(id);
            Material material = sample == null ? null : s.materials().get(sample.materialId());
            int row = material == null ? -1 : s.index().rowOf(material, id);
            if (row >= 0) {
                rows[n++] = row;
            }
        }
        return Arrays.copyOf(rows, n);
    }

    /** {@link #boundsByRow} the eleventh pass's way: every bound copied into two arrays by row. */
    private FirstBounds boundsCopiedByRow(Snapshot s, Requirement requirement, Optional<StackLayer> layer,
                                          boolean diffuseLayer, WeightedMisses.SecondStage[] second) {
        SpectralStore store = s.store();
        double[] miss = new double[store.size()];
        Arrays.fill(miss, Double.NaN);
        RowBound lower = (curve, bound) -> miss[curve] = Double.isNaN(miss[curve]) ? bound : Math.min(miss[curve], bound);
        provenMisses(s, requirement, layer, lower);
        if (screenLayerBlocks) {
            layer.ifPresent(l -> addLayerBlockMisses(store, requirement, l, lower));
        }
        double[] margin = null;
        if (screenWeighted && earlierWeightedScreen) {
            // the earlier rule keeps its maps (benchmarks only): its misses are carried over to the rows
            Map<Long, Double> earlier = new HashMap<>();
            WeightedMisses.addEarlier(earlier, store, requirement, layer, diffuseLayer);
            for (int curve = 0; curve < store.size() && !earlier.isEmpty(); curve++) {
                Double b = earlier.get(store.sampleId(curve));
                if (b != null) {
                    lower.at(curve, b);
                }
            }
        } else if (screenWeighted) {
            WeightedMisses.Screen screen = WeightedMisses.screen(store, requirement, layer, diffuseLayer, weightedLayerBlocks);
            second[0] = screen.secondStage();
            double[] bounds = screen.bounds();
            margin = new double[store.size()];
            Arrays.fill(margin, Double.NaN);
            for (int curve = 0; curve < bounds.length; curve++) {
                if (bounds[curve] < 0) {
                    lower.at(curve, bounds[curve]);
                }
                if (bounds[curve] < Double.POSITIVE_INFINITY) {
                    margin[curve] = bounds[curve];
                }
            }
        }
        // a sample whose stored record fails today's checks: no screen's bound speaks for its exact row (as by id)
        for (long id : s.unusable()) {
            SampleInfo sample = s.samples().get(id);
            Material material = sample == null ? null : s.materials().get(sample.materialId());
            int row = material == null ? -1 : s.index().rowOf(material, id);
            if (row >= 0) {
                miss[row] = Double.NaN;
                if (margin != null) {
                    margin[row] = Double.NaN;
                }
            }
        }
        int margins = 0;
        if (margin != null) {
            for (double b : margin) {
                margins += Double.isNaN(b) ? 0 : 1;
            }
        }
        return FirstBounds.byRow(miss, margin, margins);
    }

    /**
     * Sample id → an upper bound (negative) on its exact worst margin, for samples the store proves to miss
     * one of the requirement's screenable clauses (see the class comment).
     */
    static Map<Long, Double> provenMisses(Snapshot s, Requirement requirement, Optional<StackLayer> layer) {
        Map<Long, Double> out = new HashMap<>();
        provenMisses(s, requirement, layer, (curve, bound) -> out.put(s.store().sampleId(curve), bound));
        return out;
    }

    /** A bound for a store row, handed to whoever keeps a search's first bounds (by row or by sample id). */
    @FunctionalInterface
    private interface RowBound {
        void at(int curve, double bound);
    }

    /** Each store row the every-point screen proves to miss, with its bound (see {@link #provenMisses(Snapshot, Requirement, Optional)}). */
    private static void provenMisses(Snapshot s, Requirement requirement, Optional<StackLayer> layer, RowBound out) {
        List<TransmittanceClause> screened = new ArrayList<>();
        for (var clause : requirement.clauses()) {
            if (clause instanceof TransmittanceClause t && t.aggregate() == Aggregate.EVERY_POINT
                    && (layer.isEmpty() || t.direction() == Direction.PASS && insideLayer(t, layer.get()))) {
                screened.add(t);
            }
        }
        if (screened.isEmpty()) {
            return;
        }
        SpectralStore store = s.store();
        double[][] bounds = MissScreen.marginBounds(store, screened);
        for (int curve = 0; curve < store.size(); curve++) {
            double d0 = store.thicknessMm(curve);
            // the store was built with SampleRescaling's answer for every curve: no need to ask it again per clause
            boolean rescalable = store.isBulk(curve);
            double bound = Double.POSITIVE_INFINITY;
            for (int c = 0; c < screened.size(); c++) {
                if (keepsProof(screened.get(c).direction(), requirement.thickness(), d0, rescalable)) {
                    bound = Math.min(bound, bounds[c][curve]);
                }
            }
            if (bound < 0) {
                out.at(curve, bound);
            }
        }
    }

    /**
     * Lowers, or adds, the bound of each sample the store proves to miss an every-point block clause as measured
     * behind the layer ({@link LayerBlockScreen}: the stack is never darker than its parts' product). Only as
     * measured: at another thickness the candidate is rescaled before it is stacked, which this bound does not
     * follow.
     */
    static void addLayerBlockMisses(Map<Long, Double> provenMiss, SpectralStore store, Requirement requirement,
                                            StackLayer layer) {
        addLayerBlockMisses(store, requirement, layer,
                (curve, bound) -> provenMiss.merge(store.sampleId(curve), bound, Math::min));
    }

    /** Each store row {@link #addLayerBlockMisses(Map, SpectralStore, Requirement, StackLayer)} bounds, to {@code out}. */
    private static void addLayerBlockMisses(SpectralStore store, Requirement requirement, StackLayer layer, RowBound out) {
        if (requirement.thickness().kind() != ThicknessSpec.Kind.AS_MEASURED) {
            return;
        }
        List<TransmittanceClause> blocks = new ArrayList<>();
        for (var clause : requirement.clauses()) {
            if (clause instanceof TransmittanceClause t && t.aggregate() == Aggregate.EVERY_POINT
                    && t.direction() == Direction.BLOCK) {
                blocks.add(t);
            }
        }
        if (blocks.isEmpty()) {
            return;
        }
        double[][] bounds = LayerBlockScreen.marginBounds(store, blocks, layer.curve(), layer.index());
        for (double[] clauseBounds : bounds) {
            for (int curve = 0; curve < store.size(); curve++) {
                if (clauseBounds[curve] < 0) {
                    out.at(curve, clauseBounds[curve]);
                }
            }
        }
    }

    private static boolean insideLayer(TransmittanceClause t, StackLayer layer) {
        return layer.curve().covers(t.band().fromNm()) && layer.curve().covers(t.band().toNm());
    }

    /**
     * Whether a miss proven on the measured curve stays proven at the thickness the sample is judged at:
     * T falls as a bulk sample thickens, so a pass stays missed when judged at or above the measured
     * thickness and a block when judged at or below it; a fixed part only at its own thickness (elsewhere
     * it is unverified, not missed); so is a diffuse or scattering sample ({@link SampleRescaling}).
     */
    static boolean keepsProof(Direction direction, ThicknessSpec spec, double d0, boolean rescalable) {
        if (spec.kind() == ThicknessSpec.Kind.AS_MEASURED) {
            return true;
        }
        if (!(d0 > 0)) {
            return false;
        }
        if (spec.kind() == ThicknessSpec.Kind.FIXED && NominalThickness.same(d0, spec.minMm())) {
            return true; // judged as measured
        }
        if (!rescalable) {
            // a coated part, or a diffuse or scattering sample: judged only at its own thickness
            return spec.kind() == ThicknessSpec.Kind.RANGE && NominalThickness.within(d0, spec.minMm(), spec.maxMm());
        }
        return direction == Direction.PASS ? spec.minMm() >= d0 : spec.maxMm() <= d0;
    }
}

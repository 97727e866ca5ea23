package org.spectralsieve.search;

import java.util.Map;
import java.util.Optional;
import org.spectralsieve.requirement.Direction;
import org.spectralsieve.requirement.NominalThickness;
import org.spectralsieve.requirement.ThicknessSpec;
import org.spectralsieve.requirement.Requirement;
import org.spectralsieve.requirement.StackLayer;
import org.spectralsieve.requirement.WeightedClause;
import org.spectralsieve.store.SpectralStore;
import org.spectralsieve.store.WeightedScreen;

/**
 * The store's proven misses of weighted clauses ({@link WeightedScreen}), added to those of the every-point
 * clauses under the same rules (docs/weighted-screening.md): a weighted figure is a weighted mean of T, so
 * it falls wherever T falls pointwise — as a bulk sample thickens (a pass missed as measured stays missed
 * at or above the measured thickness, a block at or below it: {@link SearchService#keepsProof}) and behind
 * a layer (the stack's T is at most the part's, so only passes, and only where the layer's curve spans the
 * figure's integration points, so the stack integrates over the same points).
 */
final class WeightedMisses {

    private WeightedMisses() {
    }

    /** A fixed thickness the sample was measured at is judged on the measured curve, never rescaled. */
    private static boolean judgedAsMeasured(ThicknessSpec spec, double d0) {
        return spec.kind() == ThicknessSpec.Kind.FIXED && NominalThickness.same(d0, spec.minMm());
    }

    /**
     * Lowers, or adds, each sample's bound on its exact worst margin where a weighted clause is proven
     * missed: every clause's bound is an upper bound on that clause's margin, so the smallest of them bounds
     * the worst margin.
     */
    static void add(Map<Long, Double> provenMiss, SpectralStore store, Requirement requirement,
                    Optional<StackLayer> layer) {
        Optional<double[]> layerRange = layer.map(l -> new double[] {l.curve().minWavelengthNm(), l.curve().maxWavelengthNm()});
        WeightedScreen screen = store.weightedScreen();
        for (var clause : requirement.clauses()) {
            if (!(clause instanceof WeightedClause w) || layer.isPresent() && w.direction() != Direction.PASS) {
                continue;
            }
            double[] bounds = screen.marginBounds(w, layerRange);
            ThicknessSpec spec = requirement.thickness();
            double[] thinned = spec.kind() == ThicknessSpec.Kind.AS_MEASURED ? null
                    : screen.marginBoundsThinned(store, w, layerRange, spec.minMm());
            for (int curve = 0; curve < store.size(); curve++) {
                double bound = bounds[curve];
                double d0 = store.thicknessMm(curve);
                if (bound < 0 && SearchService.keepsProof(w.direction(), spec, d0, store.isBulk(curve))) {
                    provenMiss.merge(store.sampleId(curve), bound, Math::min);
                } else if (thinned != null && thinned[curve] < 0 && !judgedAsMeasured(spec, d0)) {
                    // a bulk sample judged thinner than measured: the pass bound thinned to the thinnest asked
                    provenMiss.merge(store.sampleId(curve), thinned[curve], Math::min);
                }
            }
        }
    }
}

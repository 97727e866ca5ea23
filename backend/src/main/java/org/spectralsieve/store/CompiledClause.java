package org.spectralsieve.store;

import java.util.ArrayList;
import java.util.List;
import org.spectralsieve.requirement.Aggregate;
import org.spectralsieve.requirement.Band;
import org.spectralsieve.requirement.Clause;
import org.spectralsieve.requirement.CutoffClause;
import org.spectralsieve.requirement.Direction;
import org.spectralsieve.requirement.TransmittanceClause;

/**
 * A clause turned into the probes it reads and the threshold as an optical density. Every kind splits
 * its margin into a part that falls with thickness (light that must pass) and a part that rises with it
 * (light that must be blocked); the thickness solver needs exactly that split.
 */
record CompiledClause(Kind kind, List<Probe> probes, double thresholdOd, double thresholdT) {

    enum Kind { EVERY_POINT_PASS, EVERY_POINT_BLOCK, MEAN_PASS, MEAN_BLOCK, CUTOFF }

    static CompiledClause compile(SpectralStore store, Clause clause) {
        if (clause instanceof TransmittanceClause t) {
            boolean pass = t.direction() == Direction.PASS;
            Kind kind = t.aggregate() == Aggregate.MEAN
                    ? (pass ? Kind.MEAN_PASS : Kind.MEAN_BLOCK)
                    : (pass ? Kind.EVERY_POINT_PASS : Kind.EVERY_POINT_BLOCK);
            return new CompiledClause(kind, bandProbes(store, t.band()), -Math.log10(t.thresholdT()), t.thresholdT());
        }
        CutoffClause c = (CutoffClause) clause;
        // probe 0: the short edge (T must be at most the level there), probe 1: the long edge (at least it)
        List<Probe> edges = List.of(Probe.at(store, c.window().fromNm(), 0), Probe.at(store, c.window().toNm(), 0));
        return new CompiledClause(Kind.CUTOFF, edges, -Math.log10(c.levelT()), c.levelT());
    }

    /** The band's ends plus every grid wavelength strictly inside, with trapezoid weights. */
    private static List<Probe> bandProbes(SpectralStore store, Band band) {
        if (band.isPoint()) {
            return List.of(Probe.at(store, band.fromNm(), 0));
        }
        List<Double> nms = new ArrayList<>();
        nms.add(band.fromNm());
        for (int w = 0; w < store.gridSize(); w++) {
            double nm = store.gridNm(w);
            if (nm > band.fromNm() && nm < band.toNm()) {
                nms.add(nm);
            }
        }
        nms.add(band.toNm());
        List<Probe> probes = new ArrayList<>(nms.size());
        for (int k = 0; k < nms.size(); k++) {
            double left = k == 0 ? 0 : (nms.get(k) - nms.get(k - 1)) / 2;
            double right = k == nms.size() - 1 ? 0 : (nms.get(k + 1) - nms.get(k)) / 2;
            probes.add(Probe.at(store, nms.get(k), left + right));
        }
        return probes;
    }

    boolean isMean() {
        return kind == Kind.MEAN_PASS || kind == Kind.MEAN_BLOCK;
    }
}

package org.spectralsieve.store;

import org.spectralsieve.requirement.Verdict;

/** What one probe's margin proves, as bits that combine across probes by OR. One place for the bound rules. */
final class ProbeVerdict {

    static final int HOLDS = 0;
    static final int MISSES = 1;
    static final int UNVERIFIED = 2;

    private ProbeVerdict() {
    }

    static int of(double margin, boolean bound, boolean pass) {
        if (bound && pass) {
            // T is at most the bound: too dark even so proves a miss, otherwise nothing is proven
            return margin < 0 ? MISSES : UNVERIFIED;
        }
        if (bound) {
            // a block is proven when the bound itself is low enough; a higher bound cannot show it
            return margin < 0 ? UNVERIFIED : HOLDS;
        }
        return margin < 0 ? MISSES : HOLDS;
    }

    static Verdict combine(int bits) {
        return (bits & MISSES) != 0 ? Verdict.MISSES : (bits & UNVERIFIED) != 0 ? Verdict.UNVERIFIED : Verdict.MEETS;
    }
}

package org.spectralsieve.store;

/** A probe of the store scan's first pass (one grid column of a clause), with what the clause asks of it. */
record PointProbe(Probe probe, double thresholdOd, boolean pass) {
}

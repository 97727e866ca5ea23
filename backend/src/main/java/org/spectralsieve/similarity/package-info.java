/**
 * "Find curves like this one", framework-free: a curve becomes a {@link org.spectralsieve.similarity.CurveSignature}
 * (absorbance on one fixed grid, per millimetre for a bulk material), and {@link org.spectralsieve.similarity.SimilarCurves}
 * ranks candidates by one of two {@link org.spectralsieve.similarity.ShapeMetric}s, exactly, each hit explaining
 * itself ({@link org.spectralsieve.similarity.SimilarHit}). An approximate nearest-neighbour index belongs at the
 * edge; its answers are re-ranked here. See docs/similar-curves.md.
 */
package org.spectralsieve.similarity;

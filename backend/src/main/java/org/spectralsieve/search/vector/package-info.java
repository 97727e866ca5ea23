/**
 * "Find curves like this one" at library scale: a Lucene HNSW index of one unit vector per sample
 * ({@link org.spectralsieve.search.vector.CurveVectors}) nominates candidates, which
 * {@link org.spectralsieve.search.vector.ExactReRank} ranks with the framework-free exact metrics. Lucene stays
 * here, at the edge. Writing ({@link org.spectralsieve.search.vector.CurveVectorIndex#write}) and reading
 * ({@link org.spectralsieve.search.vector.CurveVectorSearcher}) take a Lucene writer and reader, so the index can
 * live wherever its owner keeps it. See docs/similar-curves.md, "The vector index".
 */
package org.spectralsieve.search.vector;

package org.spectralsieve.search.vector;

import java.io.IOException;
import java.util.concurrent.ExecutorService;
import org.apache.lucene.codecs.Codec;
import org.apache.lucene.codecs.KnnVectorsFormat;
import org.apache.lucene.codecs.lucene912.Lucene912Codec;
import org.apache.lucene.codecs.lucene99.Lucene99HnswScalarQuantizedVectorsFormat;
import org.apache.lucene.codecs.lucene99.Lucene99HnswVectorsFormat;
import org.apache.lucene.document.Document;
import org.apache.lucene.document.Field;
import org.apache.lucene.document.KnnFloatVectorField;
import org.apache.lucene.document.NumericDocValuesField;
import org.apache.lucene.document.StringField;
import org.apache.lucene.index.IndexWriter;
import org.apache.lucene.index.IndexWriterConfig;
import org.apache.lucene.index.VectorSimilarityFunction;
import org.spectralsieve.similarity.CurveSignature;

/**
 * What the similar-curves vector index holds, and how it is written: one document per sample in use, with
 * its {@link CurveVectors index vector} and the facet values a search may be narrowed by. Derived from the
 * spectral store, never the truth; where it lives (memory, a directory) and when it is rebuilt is the
 * caller's business, so that it can share the text index's lifecycle later.
 */
public final class CurveVectorIndex {

    /** The vector: HNSW graph, dot product of unit vectors (= cosine, cheaper: no norms at query time). */
    static final String VECTOR = "shape";
    /** Doc values only: read for every nominated document, cheaper than a stored-fields block. */
    static final String SAMPLE = "sample";
    /** Keywords, not analysed: a filter names an exact class label, as the facet panel does. */
    public static final String CLASS = "class";
    /** Keyword: "regular" or "total", {@code Geometry.label()}. */
    public static final String GEOMETRY = "geometry";
    /** Keyword: "measured", "datasheet", …, {@code Provenance.label()}; absent when unknown. */
    public static final String PROVENANCE = "provenance";

    /**
     * Neighbours per node: 16, Lucene's default. With 400 candidates it reached recall@10 0.96 on a million
     * synthetic curves (docs/similar-curves.md); larger values were not measured.
     */
    public static final int MAX_CONNECTIONS = 16;
    /** Candidates kept while linking a new node: 100, Lucene's default; not tuned (the rebuild time is the limit). */
    public static final int BEAM_WIDTH = 100;

    private CurveVectorIndex() {
    }

    /** One sample to index; {@code provenance} may be null (the store does not know it). */
    public record Entry(long sampleId, CurveSignature signature, String materialClass, String geometry, String provenance) {
        public Entry {
            if (signature == null || materialClass == null || geometry == null) {
                throw new IllegalArgumentException("an entry needs a signature, a class and a geometry");
            }
        }
    }

    /** How the vectors are stored: full floats, or int7 scalar quantization (measured in the docs). */
    public enum Storage {
        FLOAT, INT7
    }

    /** A writer configuration with the vector field's HNSW parameters and storage. */
    public static IndexWriterConfig writerConfig(Storage storage) {
        return writerConfig(storage, MAX_CONNECTIONS, BEAM_WIDTH);
    }

    public static IndexWriterConfig writerConfig(Storage storage, int maxConnections, int beamWidth) {
        return writerConfig(storage, maxConnections, beamWidth, 1, null);
    }

    /** As above, merging graphs on {@code mergeWorkers} threads of {@code mergeExecutor} (null: the merging thread). */
    public static IndexWriterConfig writerConfig(Storage storage, int maxConnections, int beamWidth, int mergeWorkers,
            ExecutorService mergeExecutor) {
        KnnVectorsFormat format = storage == Storage.INT7
                ? new Lucene99HnswScalarQuantizedVectorsFormat(maxConnections, beamWidth, mergeWorkers, 7, false, null,
                        mergeExecutor)
                : new Lucene99HnswVectorsFormat(maxConnections, beamWidth, mergeWorkers, mergeExecutor);
        Codec codec = new Lucene912Codec() {
            @Override
            public KnnVectorsFormat getKnnVectorsFormatForField(String field) {
                return format;
            }
        };
        return new IndexWriterConfig().setCodec(codec);
    }

    /** Adds one document per entry; the caller commits. */
    public static void write(IndexWriter writer, Iterable<Entry> entries) throws IOException {
        for (Entry e : entries) {
            writer.addDocument(document(e));
        }
    }

    static Document document(Entry e) {
        return document(e.sampleId(), CurveVectors.of(e.signature()), e.materialClass(), e.geometry(), e.provenance());
    }

    /** One sample's document from its {@link CurveVectors} vector already made (a benchmark streams them). */
    public static Document document(long sampleId, float[] vector, String materialClass, String geometry, String provenance) {
        Document doc = new Document();
        doc.add(new KnnFloatVectorField(VECTOR, vector, VectorSimilarityFunction.DOT_PRODUCT));
        doc.add(new NumericDocValuesField(SAMPLE, sampleId));
        doc.add(new StringField(CLASS, materialClass, Field.Store.NO));
        doc.add(new StringField(GEOMETRY, geometry, Field.Store.NO));
        if (provenance != null) {
            doc.add(new StringField(PROVENANCE, provenance, Field.Store.NO));
        }
        return doc;
    }
}

package org.spectralsieve.search.vector;

import static org.assertj.core.api.Assertions.assertThat;

import java.io.IOException;
import java.util.ArrayList;
import java.util.Arrays;
import java.util.Comparator;
import java.util.HashSet;
import java.util.List;
import java.util.Random;
import java.util.Set;
import java.util.stream.IntStream;
import org.apache.lucene.index.DirectoryReader;
import org.apache.lucene.index.IndexWriter;
import org.apache.lucene.store.ByteBuffersDirectory;
import org.junit.jupiter.api.BeforeAll;
import org.junit.jupiter.api.Test;
import org.spectralsieve.similarity.CurveSignature;
import org.spectralsieve.similarity.ShapeMetric;
import org.spectralsieve.similarity.SimilarCurves;
import org.spectralsieve.similarity.SimilarHit;

/**
 * The vector index against the exact brute force ({@link SimilarCurves}) on 3,000 seeded synthetic curves
 * (1,000 materials, three thicknesses each). Queries: 100 of the materials at yet another thickness with fresh
 * noise at the floor. The floors are our requirement (the issue asks recall@10 ≥ 0.95), not a measured value.
 */
class CurveVectorRecallTest {

    private static final int CURVES = 3000;
    private static final int QUERIES = 100;
    private static final double REQUIRED_RECALL = 0.95;
    /** After the exact ranking of the 400 nominated candidates: measured 0.989 (correlation) and 0.972 (centred Euclidean) here; our floor below both. */
    private static final double REQUIRED_EXACT_RECALL = 0.9;

    private static List<SyntheticSignatures.Sample> corpus;
    private static List<SimilarCurves.Candidate> candidates;
    private static List<CurveSignature> queries;
    private static CurveVectorSearcher searcher;

    @BeforeAll
    static void buildCorpusAndIndex() throws IOException {
        SyntheticSignatures synthetic = new SyntheticSignatures(20261204L);
        corpus = IntStream.range(0, CURVES).mapToObj(i -> synthetic.next()).toList();
        candidates = IntStream.range(0, CURVES)
                .mapToObj(i -> new SimilarCurves.Candidate(String.valueOf(i), corpus.get(i).signature())).toList();
        Random random = new Random(7);
        queries = new ArrayList<>();
        for (int q = 0; q < QUERIES; q++) {
            SyntheticSignatures.Sample s = corpus.get(random.nextInt(CURVES));
            queries.add(s.at(0.5 + random.nextDouble() * 9.5, random));
        }
        ByteBuffersDirectory directory = new ByteBuffersDirectory();
        try (IndexWriter writer = new IndexWriter(directory, CurveVectorIndex.writerConfig(CurveVectorIndex.Storage.FLOAT))) {
            CurveVectorIndex.write(writer, IntStream.range(0, CURVES).mapToObj(i -> entry(i, corpus.get(i))).toList());
        }
        searcher = new CurveVectorSearcher(DirectoryReader.open(directory));
    }

    static CurveVectorIndex.Entry entry(long id, SyntheticSignatures.Sample s) {
        return new CurveVectorIndex.Entry(id, s.signature(), s.bulk() ? "plastic sheet" : "coated film",
                id % 5 == 0 ? "total" : "regular", null);
    }

    @Test
    void theGraphFindsTheNearestVectorsAsBruteForceDoes() {
        double recall = 0;
        for (CurveSignature q : queries) {
            float[] v = CurveVectors.of(q);
            Set<Long> exact = bruteForceByVector(v, CurveVectors.STRIDE, 10);
            long[] nearest = searcher.nearest(v, CurveVectorSearcher.candidatesFor(10), VectorFilter.NONE);
            recall += overlap(exact, Arrays.copyOf(nearest, 10));
        }
        recall /= QUERIES * 10.0;
        System.out.printf("RECALL vector-stage recall@10=%.3f%n", recall);
        assertThat(recall).isGreaterThanOrEqualTo(REQUIRED_RECALL);
    }

    @Test
    void reRankingTheNominatedCandidatesGivesTheExactTopTenForBothMetrics() {
        for (ShapeMetric metric : ShapeMetric.values()) {
            double recall = 0;
            int sameDistances = 0;
            for (CurveSignature q : queries) {
                List<SimilarHit> exact = SimilarCurves.rank(q, candidates, metric, 10);
                List<SimilarHit> approximate = SimilarCurves.rank(q,
                        nominated(searcher.nearest(q, CurveVectorSearcher.candidatesFor(10), VectorFilter.NONE)), metric, 10);
                Set<Long> exactIds = new HashSet<>();
                exact.forEach(h -> exactIds.add(Long.parseLong(h.id())));
                recall += overlap(exactIds, approximate.stream().mapToLong(h -> Long.parseLong(h.id())).toArray());
                sameDistances += approximate.get(0).distance() == exact.get(0).distance() ? 1 : 0;
            }
            recall /= QUERIES * 10.0;
            System.out.printf("RECALL metric=%s exact-after-rerank recall@10=%.3f first-hit-exact=%d/%d%n", metric, recall,
                    sameDistances, QUERIES);
            assertThat(recall).as(metric.name()).isGreaterThanOrEqualTo(REQUIRED_EXACT_RECALL);
        }
    }

    /** The representation alone (brute force over the vectors, no graph): 10 nm keeps what 5 nm finds. */
    @Test
    void aTenNanometreVectorNominatesTheExactTopTenAsWellAsAFiveNanometreOne() {
        for (int stride : new int[] {1, 2, 4}) {
            for (ShapeMetric metric : ShapeMetric.values()) {
                double recall = 0;
                for (CurveSignature q : queries) {
                    Set<Long> exactIds = new HashSet<>();
                    SimilarCurves.rank(q, candidates, metric, 10).forEach(h -> exactIds.add(Long.parseLong(h.id())));
                    long[] nominated = bruteForceByVector(CurveVectors.of(q, stride), stride, CurveVectorSearcher.candidatesFor(10)).stream()
                            .mapToLong(Long::longValue).toArray();
                    List<SimilarHit> reranked = SimilarCurves.rank(q, nominated(nominated), metric, 10);
                    recall += overlap(exactIds, reranked.stream().mapToLong(h -> Long.parseLong(h.id())).toArray());
                }
                recall /= QUERIES * 10.0;
                System.out.printf("RECALL stride=%d nm=%d metric=%s k'=%d recall@10=%.3f%n", stride,
                        (int) (stride * CurveSignature.STEP_NM), metric, CurveVectorSearcher.candidatesFor(10), recall);
                if (stride <= CurveVectors.STRIDE) {
                    assertThat(recall).as(stride + " " + metric).isGreaterThanOrEqualTo(REQUIRED_EXACT_RECALL);
                }
            }
        }
    }

    @Test
    void theTwoStepReRankingAnswersAsTheFullExactRankingOverTheSameCandidates() {
        for (ShapeMetric metric : ShapeMetric.values()) {
            for (CurveSignature q : queries.subList(0, 20)) {
                List<SimilarCurves.Candidate> nominated = nominated(searcher.nearest(q, 200, VectorFilter.NONE));
                assertThat(ExactReRank.rank(q, nominated, metric, 10)).isEqualTo(SimilarCurves.rank(q, nominated, metric, 10));
            }
        }
    }

    @Test
    void aFacetFilterAdmitsOnlyCurvesWithThatValue() {
        VectorFilter totalOnly = new VectorFilter(Set.of(), Set.of("total"), Set.of());
        for (CurveSignature q : queries.subList(0, 10)) {
            long[] ids = searcher.nearest(q, 20, totalOnly);
            assertThat(ids).hasSize(20);
            assertThat(Arrays.stream(ids).boxed()).allMatch(id -> id % 5 == 0);
        }
        VectorFilter films = new VectorFilter(Set.of("coated film"), Set.of("total"), Set.of());
        long[] ids = searcher.nearest(queries.get(0), 20, films);
        assertThat(ids).isNotEmpty();
        assertThat(Arrays.stream(ids).boxed()).allMatch(id -> id % 5 == 0 && !corpus.get(id.intValue()).bulk());
    }

    private static List<SimilarCurves.Candidate> nominated(long[] ids) {
        return Arrays.stream(ids).mapToObj(id -> candidates.get((int) id)).toList();
    }

    private static Set<Long> bruteForceByVector(float[] v, int stride, int k) {
        Integer[] order = IntStream.range(0, CURVES).boxed().toArray(Integer[]::new);
        double[] score = new double[CURVES];
        for (int i = 0; i < CURVES; i++) {
            float[] u = CurveVectors.of(corpus.get(i).signature(), stride);
            double dot = 0;
            for (int j = 0; j < u.length; j++) {
                dot += u[j] * v[j];
            }
            score[i] = dot;
        }
        Arrays.sort(order, Comparator.comparingDouble((Integer i) -> -score[i]));
        Set<Long> top = new java.util.LinkedHashSet<>();
        for (int i = 0; i < k; i++) {
            top.add((long) order[i]);
        }
        return top;
    }

    private static int overlap(Set<Long> exact, long[] found) {
        int n = 0;
        for (long id : found) {
            n += exact.contains(id) ? 1 : 0;
        }
        return n;
    }
}

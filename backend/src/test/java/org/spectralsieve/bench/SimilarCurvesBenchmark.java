package org.spectralsieve.bench;

import static org.spectralsieve.bench.BenchStats.ms;
import static org.spectralsieve.bench.BenchStats.percentile;

import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.Comparator;
import java.util.List;
import java.util.PriorityQueue;
import java.util.Random;
import java.util.concurrent.ExecutorService;
import java.util.concurrent.Executors;
import java.util.concurrent.atomic.AtomicInteger;
import java.util.stream.IntStream;
import org.apache.lucene.index.DirectoryReader;
import org.apache.lucene.index.IndexWriter;
import org.apache.lucene.index.IndexWriterConfig;
import org.apache.lucene.store.FSDirectory;
import org.junit.jupiter.api.Test;
import org.spectralsieve.search.SimilarSamples;
import org.spectralsieve.search.vector.CurveVectorIndex;
import org.spectralsieve.search.vector.ExactReRank;
import org.spectralsieve.search.vector.CurveVectorSearcher;
import org.spectralsieve.search.vector.CurveVectors;
import org.spectralsieve.search.vector.SyntheticSignatures;
import org.spectralsieve.search.vector.VectorFilter;
import org.spectralsieve.similarity.CurveSignature;
import org.spectralsieve.similarity.ShapeMetric;
import org.spectralsieve.similarity.SimilarCurves;
import org.spectralsieve.similarity.SimilarHit;

/**
 * Similar curves through the HNSW vector index (docs/similar-curves.md, "Benchmark"). Prints
 * {@code BENCH index-rebuild}, {@code BENCH similar} and {@code BENCH similar-exact}; asserts nothing about time.
 *
 * <p>Library: {@link SyntheticSignatures} (seeded; three thicknesses per material, noise at the floor). Queries:
 * 100 library materials at another thickness with fresh noise. One search = the KNN query for
 * {@link CurveVectorSearcher#candidatesFor}(10) candidates plus the exact ranking of those candidates (their
 * signatures re-created outside the timing: the service holds them in memory). {@code recall_at_10}: the
 * graph's top ten against brute force over the same vectors; {@code similar-exact}: the final top ten against
 * the exact brute-force ranking of the whole library (only up to {@code bench.similarExactUpTo}, it costs
 * minutes). Switches: {@code -Dbench.similarSizes=100000,1000000}, {@code -Dbench.similarQueries=100},
 * {@code -Dbench.similarM=16}, {@code -Dbench.similarBeam=100}, {@code -Dbench.similarStorage=FLOAT|INT7},
 * {@code -Dbench.similarExactUpTo=100000}, {@code -Dbench.similarBufferMb=2048}, {@code -Dbench.similarForceMerge=false}, {@code -Dbench.similarCandidates=} (k′, default the service's).
 */
class SimilarCurvesBenchmark {

    private static final long SEED = 20261204L;
    private static final int K = 10;

    @Test
    void similarCurvesOverSyntheticLibraries() throws Exception {
        int queries = BenchStats.intProperty("bench.similarQueries", 100);
        int m = BenchStats.intProperty("bench.similarM", CurveVectorIndex.MAX_CONNECTIONS);
        int beam = BenchStats.intProperty("bench.similarBeam", CurveVectorIndex.BEAM_WIDTH);
        CurveVectorIndex.Storage storage = CurveVectorIndex.Storage.valueOf(System.getProperty("bench.similarStorage", "FLOAT"));
        int exactUpTo = BenchStats.intProperty("bench.similarExactUpTo", 100_000);
        for (int n : BenchStats.intList("bench.similarSizes", "100000,1000000")) {
            run(n, queries, m, beam, storage, exactUpTo);
        }
    }

    private static void run(int n, int queryCount, int m, int beam, CurveVectorIndex.Storage storage, int exactUpTo)
            throws Exception {
        SyntheticSignatures synthetic = new SyntheticSignatures(SEED);
        int dim = CurveVectors.DIMENSION;
        // the vectors once, flat (n × 51 floats, 204 MB at 1M): not timed, a rebuild reads signatures from the store
        long g0 = System.nanoTime();
        float[] vectors = new float[n * dim];
        IntStream.range(0, n).parallel().forEach(i ->
                System.arraycopy(CurveVectors.of(synthetic.sample(i).signature()), 0, vectors, i * dim, dim));
        double signatureSeconds = (System.nanoTime() - g0) / 1e9;

        Path dir = Files.createTempDirectory("similar-bench-");
        ExecutorService mergers = Executors.newFixedThreadPool(2);
        long t0 = System.nanoTime();
        // a buffer that holds a million documents: each of the two threads fills its own segment and builds its
        // graph, and no merge builds them again (a forced merge to one segment took about three times as long at 100k)
        IndexWriterConfig config = CurveVectorIndex.writerConfig(storage, m, beam, 2, mergers)
                .setRAMBufferSizeMB(BenchStats.intProperty("bench.similarBufferMb", 2048));
        try (FSDirectory directory = FSDirectory.open(dir); IndexWriter writer = new IndexWriter(directory, config)) {
            AtomicInteger next = new AtomicInteger();
            Thread[] threads = new Thread[2];
            for (int t = 0; t < threads.length; t++) {
                threads[t] = new Thread(() -> {
                    try {
                        for (int i = next.getAndIncrement(); i < n; i = next.getAndIncrement()) {
                            writer.addDocument(CurveVectorIndex.document(i,
                                    java.util.Arrays.copyOfRange(vectors, i * dim, (i + 1) * dim),
                                    i % 3 == 2 ? "coated film" : "plastic sheet", i % 5 == 0 ? "total" : "regular", null));
                        }
                    } catch (Exception e) {
                        throw new IllegalStateException(e);
                    }
                });
                threads[t].start();
            }
            for (Thread t : threads) {
                t.join();
            }
            if (Boolean.getBoolean("bench.similarForceMerge")) {
                writer.forceMerge(1);
            }
            writer.commit();
        }
        double seconds = (System.nanoTime() - t0) / 1e9;
        mergers.shutdown();
        long bytes;
        try (var files = Files.list(dir)) {
            bytes = files.mapToLong(p -> p.toFile().length()).sum();
        }
        System.out.printf("BENCH index-rebuild curves=%d seconds=%.1f bytes_per_curve=%.0f%n", n, seconds, bytes / (double) n);
        int segments;
        try (FSDirectory directory = FSDirectory.open(dir); DirectoryReader reader = DirectoryReader.open(directory)) {
            segments = reader.leaves().size();
        }
        System.out.printf("BENCH similar-settings curves=%d m=%d beam=%d storage=%s dims=%d candidates=%d segments=%d"
                + " signature_seconds=%.1f%n", n, m, beam, storage, dim, BenchStats.intProperty("bench.similarCandidates", CurveVectorSearcher.candidatesFor(K)), segments,
                signatureSeconds);

        Random random = new Random(99);
        List<CurveSignature> queries = new ArrayList<>();
        for (int q = 0; q < queryCount; q++) {
            SyntheticSignatures.Sample s = synthetic.sample(random.nextInt(n));
            queries.add(s.at(0.5 + random.nextDouble() * 9.5, random));
        }
        try (FSDirectory directory = FSDirectory.open(dir); DirectoryReader reader = DirectoryReader.open(directory)) {
            CurveVectorSearcher searcher = new CurveVectorSearcher(reader);
            int k = BenchStats.intProperty("bench.similarCandidates", CurveVectorSearcher.candidatesFor(K));
            for (int w = 0; w < 20; w++) {
                searcher.nearest(queries.get(w % queryCount), k, VectorFilter.NONE); // warm-up: JIT, page cache
            }
            double[] ms = new double[queryCount];
            double[] knnMs = new double[queryCount];
            double recall = 0;
            List<long[]> nominated = new ArrayList<>();
            for (int q = 0; q < queryCount; q++) {
                CurveSignature query = queries.get(q);
                long a = System.nanoTime();
                long[] ids = searcher.nearest(query, k, VectorFilter.NONE);
                long b = System.nanoTime();
                List<SimilarCurves.Candidate> candidates = new ArrayList<>(ids.length);
                for (long id : ids) {
                    candidates.add(new SimilarCurves.Candidate(String.valueOf(id), synthetic.sample((int) id).signature()));
                }
                long c = System.nanoTime();
                ExactReRank.rank(query, candidates, SimilarSamples.DEFAULT_METRIC, K);
                long d = System.nanoTime();
                knnMs[q] = (b - a) / 1e6;
                ms[q] = ((b - a) + (d - c)) / 1e6;
                nominated.add(ids);
                recall += overlap(bruteForceByVector(CurveVectors.of(query), vectors, dim, n, K), java.util.Arrays.copyOf(ids, K));
            }
            recall /= queryCount * (double) K;
            System.out.printf("BENCH similar curves=%d p50_ms=%s recall_at_10=%.3f%n", n, ms(percentile(ms, 50)), recall);
            System.out.printf("BENCH similar-detail curves=%d p95_ms=%s knn_p50_ms=%s%n", n, ms(percentile(ms, 95)),
                    ms(percentile(knnMs, 50)));
            if (n <= exactUpTo) {
                exactRecall(synthetic, n, queries, nominated);
            }
        }
        try (var files = Files.walk(dir)) {
            files.sorted(Comparator.reverseOrder()).forEach(p -> p.toFile().delete());
        }
    }

    /** The final top ten against the exact ranking of the whole library, both metrics, signatures streamed. */
    private static void exactRecall(SyntheticSignatures synthetic, int n, List<CurveSignature> queries, List<long[]> nominated) {
        for (ShapeMetric metric : ShapeMetric.values()) {
            int qn = queries.size();
            @SuppressWarnings("unchecked")
            PriorityQueue<double[]>[] best = new PriorityQueue[qn]; // {distance, id}, worst on top
            for (int q = 0; q < qn; q++) {
                best[q] = new PriorityQueue<>(Comparator.comparingDouble((double[] e) -> -e[0]).thenComparingDouble(e -> e[1]));
            }
            int chunk = 4096;
            IntStream.range(0, (n + chunk - 1) / chunk).parallel().forEach(ci -> {
                List<CurveSignature> block = new ArrayList<>();
                for (int i = ci * chunk; i < Math.min(n, (ci + 1) * chunk); i++) {
                    block.add(synthetic.sample(i).signature());
                }
                for (int q = 0; q < qn; q++) {
                    List<double[]> local = new ArrayList<>();
                    for (int j = 0; j < block.size(); j++) {
                        double d = SimilarCurves.distance(queries.get(q), block.get(j), metric);
                        if (!Double.isNaN(d)) {
                            local.add(new double[] {d, ci * chunk + j});
                        }
                    }
                    local.sort(Comparator.comparingDouble((double[] e) -> e[0]).thenComparingDouble(e -> e[1]));
                    synchronized (best[q]) {
                        for (double[] e : local.subList(0, Math.min(K, local.size()))) {
                            best[q].add(e);
                            if (best[q].size() > K) {
                                best[q].poll();
                            }
                        }
                    }
                }
            });
            double recall = 0;
            int firstSame = 0;
            for (int q = 0; q < qn; q++) {
                java.util.Set<Long> exact = new java.util.HashSet<>();
                double firstDistance = Double.MAX_VALUE;
                for (double[] e : best[q]) {
                    exact.add((long) e[1]);
                    firstDistance = Math.min(firstDistance, e[0]);
                }
                List<SimilarCurves.Candidate> candidates = new ArrayList<>();
                for (long id : nominated.get(q)) {
                    candidates.add(new SimilarCurves.Candidate(String.valueOf(id), synthetic.sample((int) id).signature()));
                }
                List<SimilarHit> hits = SimilarCurves.rank(queries.get(q), candidates, metric, K);
                long[] found = hits.stream().mapToLong(h -> Long.parseLong(h.id())).toArray();
                recall += overlap(exact, found);
                firstSame += !hits.isEmpty() && hits.get(0).distance() == firstDistance ? 1 : 0;
            }
            System.out.printf("BENCH similar-exact curves=%d metric=%s recall_at_10=%.3f first_hit_exact=%d/%d%n", n,
                    SimilarSamples.metricName(metric), recall / (qn * (double) K), firstSame, qn);
        }
    }

    private static java.util.Set<Long> bruteForceByVector(float[] v, float[] vectors, int dim, int n, int k) {
        PriorityQueue<double[]> best = new PriorityQueue<>(Comparator.comparingDouble((double[] e) -> e[0]));
        for (int i = 0; i < n; i++) {
            double dot = 0;
            int base = i * dim;
            for (int j = 0; j < dim; j++) {
                dot += v[j] * vectors[base + j];
            }
            if (best.size() < k) {
                best.add(new double[] {dot, i});
            } else if (dot > best.peek()[0]) {
                best.poll();
                best.add(new double[] {dot, i});
            }
        }
        java.util.Set<Long> out = new java.util.HashSet<>();
        best.forEach(e -> out.add((long) e[1]));
        return out;
    }

    private static int overlap(java.util.Set<Long> exact, long[] found) {
        int hits = 0;
        for (long id : found) {
            hits += exact.contains(id) ? 1 : 0;
        }
        return hits;
    }
}

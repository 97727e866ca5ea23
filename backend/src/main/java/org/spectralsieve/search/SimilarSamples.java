package org.spectralsieve.search;

import java.util.ArrayList;
import java.util.HashMap;
import java.util.List;
import java.util.Map;
import java.util.concurrent.atomic.AtomicReference;
import org.spectralsieve.library.Geometry;
import org.spectralsieve.library.JooqLibraryRepository;
import org.spectralsieve.library.Material;
import org.spectralsieve.library.NotFoundException;
import org.spectralsieve.library.SampleInfo;
import org.spectralsieve.library.SampleRescaling;
import org.spectralsieve.search.vector.ExactReRank;
import org.spectralsieve.search.vector.VectorFilter;
import org.spectralsieve.similarity.ComparedBand;
import org.spectralsieve.similarity.CurveSignature;
import org.spectralsieve.similarity.ShapeMetric;
import org.spectralsieve.similarity.SimilarCurves;
import org.spectralsieve.similarity.SimilarHit;
import org.spectralsieve.spectrum.Curve;
import org.spectralsieve.store.SpectralStore;
import org.spectralsieve.store.StoredMaterial;

/**
 * The stored samples whose curves look most like one sample's, ranked exactly ({@link SimilarCurves}) over
 * every curve in use, or, in a library larger than {@link #EXACT_UP_TO}, over the candidates the vector index
 * nominates (docs/similar-curves.md). The candidates are the search
 * store's curves — the library as {@link SearchService} last read it, retired samples and materials excluded —
 * and their signatures are computed once per store, not per request.
 */
public final class SimilarSamples {

    public static final int DEFAULT_LIMIT = 10;
    /** A ranking is read by a person: 50 rows are already more than one compares by eye. */
    public static final int MAX_LIMIT = 50;
    /**
     * Centred Euclidean: a stored sample's thickness is known, and this metric also uses the magnitude, so it
     * tells a paler stock of the same shape apart (86 of 88 against 85 of 88 in the identification test).
     */
    public static final ShapeMetric DEFAULT_METRIC = ShapeMetric.CENTRED_EUCLIDEAN;

    /** The metrics' names in the API and on the command line, {@link ShapeMetric} order. */
    public static final List<String> METRIC_NAMES = java.util.Arrays.stream(ShapeMetric.values())
            .map(SimilarSamples::metricName).toList();

    /**
     * Up to this many curves every one is compared (exactly, a few milliseconds); above it the vector index
     * nominates the candidates ({@link SimilarCandidates}). The demo library (about 90) stays exact.
     */
    public static final int EXACT_UP_TO = 2000;

    private final SearchService search;
    private final JooqLibraryRepository library;
    private final int exactUpTo;
    private final AtomicReference<Signed> signed = new AtomicReference<>();

    public SimilarSamples(SearchService search, JooqLibraryRepository library) {
        this(search, library, EXACT_UP_TO);
    }

    /** {@code exactUpTo}: the library size up to which no vector index is built (tests use 0). */
    SimilarSamples(SearchService search, JooqLibraryRepository library, int exactUpTo) {
        this.search = search;
        this.library = library;
        this.exactUpTo = exactUpTo;
    }

    /** "correlation", "centred-euclidean". */
    public static String metricName(ShapeMetric metric) {
        return metric.name().toLowerCase(java.util.Locale.ROOT).replace('_', '-');
    }

    /** The metric of that name (case and surrounding blanks ignored), or empty. */
    public static java.util.Optional<ShapeMetric> metricNamed(String name) {
        String wanted = name.trim().toLowerCase(java.util.Locale.ROOT);
        return java.util.Arrays.stream(ShapeMetric.values()).filter(m -> metricName(m).equals(wanted)).findFirst();
    }

    /** One hit with what names it: the sample's material and thickness. */
    public record Hit(long materialId, String materialName, String materialClass, long sampleId, double thicknessMm,
                      SimilarHit similarity) {
    }

    /** A store's curves as similarity candidates, by sample id. */
    private record Signed(SpectralStore store, Map<Long, Integer> curveOfSample, List<SimilarCurves.Candidate> candidates,
                          SimilarCandidates vectors) {
    }

    /**
     * The {@code limit} samples nearest to sample {@code sampleId} by {@code metric}, nearest first; the
     * sample itself is left out, the other samples of its material are not.
     *
     * @throws NotFoundException when no sample has that id
     */
    public List<Hit> similarTo(long sampleId, ShapeMetric metric, int limit) {
        if (limit < 1 || limit > MAX_LIMIT) {
            throw new IllegalArgumentException("limit must lie in [1, " + MAX_LIMIT + "], was " + limit);
        }
        return similarTo(signatureOf(sampleId), java.util.OptionalLong.of(sampleId), metric, ComparedBand.WHOLE_GRID,
                limit);
    }

    /**
     * As {@link #similarTo(long, ShapeMetric, int)}, compared only over the grid points inside {@code band}.
     *
     * @throws NotFoundException when no sample has that id
     */
    public List<Hit> similarTo(long sampleId, ShapeMetric metric, ComparedBand band, int limit) {
        return similarTo(signatureOf(sampleId), java.util.OptionalLong.of(sampleId), metric, band, limit);
    }

    /**
     * The {@code limit} stored samples nearest to {@code query} over {@code band}, nearest first, ranked
     * exactly over every curve in use (in a library above {@link #EXACT_UP_TO} curves and over the whole grid:
     * over the candidates the vector index nominates); {@code leaveOut} (a stored query's own sample) is never a hit. The
     * query may be any curve — a stored sample's or an unsaved file's.
     */
    public List<Hit> similarTo(CurveSignature query, java.util.OptionalLong leaveOut, ShapeMetric metric,
                               ComparedBand band, int limit) {
        return similarTo(query, leaveOut, metric, band, VectorFilter.NONE, limit);
    }

    /**
     * As above, among the stored curves whose material class and sample geometry {@code narrowing} admits
     * (its provenance dimension must be empty: the store keeps no provenance). The same facets narrow the
     * vector index's graph search and the exact ranking, so both paths answer alike.
     */
    public List<Hit> similarTo(CurveSignature query, java.util.OptionalLong leaveOut, ShapeMetric metric,
                               ComparedBand band, VectorFilter narrowing, int limit) {
        if (!narrowing.provenances().isEmpty()) {
            throw new IllegalArgumentException("similar curves cannot be narrowed by provenance");
        }
        if (limit < 1) {
            throw new IllegalArgumentException("limit must be at least 1, was " + limit);
        }
        Signed s = signed();
        String own = leaveOut.isPresent() ? String.valueOf(leaveOut.getAsLong()) : null;
        // the vector index nominates for the whole grid only: its vectors hold 250-700 nm as one shape, so a
        // question about one band is ranked exactly over every curve (slower, never a nearer curve missed)
        boolean nominated = s.vectors() != null && band.equals(ComparedBand.WHOLE_GRID);
        List<SimilarCurves.Candidate> pool = nominated
                ? s.vectors().nominate(query, limit + 1, narrowing, s.candidates(), s.curveOfSample()) : s.candidates();
        List<SimilarCurves.Candidate> others = pool.stream()
                .filter(c -> own == null || !c.id().equals(own))
                .filter(c -> admits(s, narrowing, c))
                .toList();
        return named(s, ExactReRank.rank(query, others, metric, band, limit));
    }

    /** Whether the candidate's material class and geometry are among those chosen (an empty choice admits all). */
    private static boolean admits(Signed s, VectorFilter narrowing, SimilarCurves.Candidate c) {
        if (narrowing.isEmpty()) {
            return true;
        }
        int curve = s.curveOfSample().get(Long.parseLong(c.id()));
        String geometry = s.store().isTotalGeometry(curve) ? Geometry.TOTAL.label() : Geometry.REGULAR.label();
        return (narrowing.classes().isEmpty() || narrowing.classes().contains(s.store().material(curve).materialClass()))
                && (narrowing.geometries().isEmpty() || narrowing.geometries().contains(geometry));
    }

    /** The signature a stored sample is asked about with (see {@link #query}). */
    public CurveSignature signatureOf(long sampleId) {
        return query(signed(), sampleId);
    }

    /** The material a sample belongs to, retired or not. */
    public long materialOf(long sampleId) {
        Signed s = signed();
        Integer curve = s.curveOfSample().get(sampleId);
        if (curve != null) {
            return s.store().material(curve).id();
        }
        return library.findSample(sampleId).orElseThrow(() -> new NotFoundException("sample", sampleId)).materialId();
    }

    private static List<Hit> named(Signed s, List<SimilarHit> ranked) {
        List<Hit> hits = new ArrayList<>(ranked.size());
        for (SimilarHit hit : ranked) {
            int curve = s.curveOfSample().get(Long.parseLong(hit.id()));
            StoredMaterial m = s.store().material(curve);
            double mm = Double.parseDouble(Float.toString((float) s.store().thicknessMm(curve)));
            hits.add(new Hit(m.id(), m.name(), m.materialClass(), s.store().sampleId(curve), mm, hit));
        }
        return List.copyOf(hits);
    }

    /**
     * The query's signature: from the store when the sample is in use, else (a retired sample, asked for by
     * id as everything retired is) from its stored curve.
     */
    private CurveSignature query(Signed s, long sampleId) {
        Integer curve = s.curveOfSample().get(sampleId);
        if (curve != null) {
            return s.candidates().get(curve).signature();
        }
        SampleInfo sample = library.findSample(sampleId).orElseThrow(() -> new NotFoundException("sample", sampleId));
        Material material = library.findMaterial(sample.materialId())
                .orElseThrow(() -> new NotFoundException("sample", sampleId));
        Curve stored = library.findCurve(sampleId).orElseThrow(() -> new NotFoundException("sample", sampleId));
        return CurveSignature.of(stored, sample.thicknessMm(), SampleRescaling.of(material, sample).rescalable());
    }

    /** The signatures of the current store, computed again only when the store was rebuilt. */
    private Signed signed() {
        SpectralStore store = search.store();
        Signed s = signed.get();
        if (s != null && s.store() == store) {
            return s;
        }
        Map<Long, Integer> curveOfSample = new HashMap<>();
        List<SimilarCurves.Candidate> candidates = new ArrayList<>(store.size());
        for (int curve = 0; curve < store.size(); curve++) {
            curveOfSample.put(store.sampleId(curve), curve);
            candidates.add(new SimilarCurves.Candidate(String.valueOf(store.sampleId(curve)),
                    CurveSignature.of(store.curve(curve), store.thicknessMm(curve), store.isBulk(curve))));
        }
        List<SimilarCurves.Candidate> all = List.copyOf(candidates);
        SimilarCandidates vectors = store.size() > exactUpTo ? SimilarCandidates.build(store, all) : null;
        Signed built = new Signed(store, Map.copyOf(curveOfSample), all, vectors);
        signed.set(built);
        return built;
    }
}

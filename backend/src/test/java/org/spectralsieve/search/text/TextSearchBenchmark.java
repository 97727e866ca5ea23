package org.spectralsieve.search.text;

import java.util.ArrayList;
import java.util.Arrays;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.Random;
import java.util.Set;
import org.junit.jupiter.api.Test;
import org.spectralsieve.library.Geometry;
import org.spectralsieve.library.Material;
import org.spectralsieve.library.MaterialClass;
import org.spectralsieve.library.Provenance;
import org.spectralsieve.library.SampleInfo;
import org.spectralsieve.library.Scaling;
import org.spectralsieve.optics.ConstantIndex;

/**
 * The library text index ({@link LibraryTextIndex} and {@link LibraryIndexSchema} as they are) over synthetic
 * materials, three samples each, so {@code curves} counts samples as the other benchmarks do. A query is one or
 * two words (a whole word, or a prefix as typed) plus one facet value, with drill-sideways facet counts: what
 * the library panel asks. Prints {@code BENCH text curves=<n> p50_ms=<x>} and {@code BENCH text-build};
 * asserts nothing about time. Lives in the text package because the index is package-private. Switches:
 * {@code -Dbench.textSizes=100000,1000000}, {@code -Dbench.textRuns=200}. Stock names are invented.
 */
class TextSearchBenchmark {

    private static final String[] LOOKS = {"clear", "smoked", "opal", "bronze", "frosted", "tinted", "grey", "amber",
            "blue", "green", "matt", "gloss", "weathered", "scratch-resistant", "UV-stabilised", "UV-transmitting"};
    private static final String[] KINDS = {"acrylic", "polycarbonate", "polyester film", "PETG sheet", "float glass",
            "borosilicate glass", "fused silica", "fluoropolymer film", "polystyrene", "cellulose acetate",
            "resin lid", "laminated glass", "coated glass", "stencil film", "inkjet film", "polypropylene"};
    private static final String[] TAGS = {"offcut", "shelf b", "shelf c", "cure box", "print bed", "window", "lamp cover",
            "mask", "lid", "spare", "sample pack", "old stock"};
    private static final String[] QUERY_WORDS = {"acryl", "clear acrylic", "polycarb", "smoked", "float glass", "film",
            "opal", "frosted polycarbonate", "borosil", "amber", "UV-stab", "lamp cover", "silica", "green film",
            "weathered", "gloss petg"};

    @Test
    void textSearchWithFacetsOverSyntheticLibraries() {
        int runs = Integer.parseInt(System.getProperty("bench.textRuns", "200"));
        for (String size : System.getProperty("bench.textSizes", "100000,1000000").split(",")) {
            int curves = Integer.parseInt(size.trim());
            long t0 = System.nanoTime();
            List<IndexedMaterial> materials = materials(curves, new Random(20261204L));
            LibraryTextIndex index = LibraryTextIndex.build(materials, 1);
            double buildSeconds = (System.nanoTime() - t0) / 1e9;
            materials = null;
            Random random = new Random(5);
            List<LibraryQuery> queries = new ArrayList<>();
            for (int q = 0; q < runs; q++) {
                queries.add(query(random));
            }
            for (int w = 0; w < 30; w++) {
                index.search(queries.get(w % runs));
            }
            double[] ms = new double[runs];
            long admitted = 0;
            for (int q = 0; q < runs; q++) {
                long a = System.nanoTime();
                LibraryAnswer answer = index.search(queries.get(q));
                ms[q] = (System.nanoTime() - a) / 1e6;
                admitted += answer.total();
            }
            Arrays.sort(ms);
            System.out.printf(Locale.ROOT, "BENCH text curves=%d p50_ms=%.3f%n", curves, ms[runs / 2]);
            System.out.printf(Locale.ROOT, "BENCH text-detail curves=%d materials=%d p95_ms=%.3f mean_hits=%.0f build_seconds=%.1f%n",
                    curves, curves / 3, ms[(int) Math.ceil(0.95 * runs) - 1], admitted / (double) runs, buildSeconds);
        }
    }

    /** One or two words and one facet value, from any of the four sample facet dimensions or the UV edge band. */
    private static LibraryQuery query(Random random) {
        String words = QUERY_WORDS[random.nextInt(QUERY_WORDS.length)];
        Set<String> classes = Set.of();
        Set<Geometry> geometries = Set.of();
        Set<Provenance> provenances = Set.of();
        Set<String> bands = Set.of();
        Map<String, Set<String>> spectral = Map.of();
        switch (random.nextInt(5)) {
            case 0 -> classes = Set.of(MaterialClass.KNOWN.get(random.nextInt(MaterialClass.KNOWN.size())));
            case 1 -> geometries = Set.of(Geometry.values()[random.nextInt(2)]);
            case 2 -> provenances = Set.of(Provenance.values()[random.nextInt(Provenance.values().length)]);
            case 3 -> bands = Set.of(LibraryIndexSchema.THICKNESS_BANDS.get(random.nextInt(4)));
            default -> spectral = Map.of(LibraryIndexSchema.EDGE_FACET, Set.of(pick(SpectralSummary.EDGE_BANDS, random)));
        }
        return new LibraryQuery(words, classes, geometries, provenances, bands, spectral, LibraryQuery.DEFAULT_LIMIT);
    }

    private static <T> T pick(List<T> values, Random random) {
        return values.get(random.nextInt(values.size()));
    }

    /** Random summary values: the bench measures the index, not the summaries' computation. */
    private static SpectralSummary summary(Random random) {
        return new SpectralSummary(pick(SpectralSummary.EDGE_BANDS, random), pick(SpectralSummary.LUMINOUS_BANDS, random),
                pick(SpectralSummary.AT_VALUES, random), pick(SpectralSummary.AT_VALUES, random),
                pick(SpectralSummary.AT_VALUES, random));
    }

    private static List<IndexedMaterial> materials(int curves, Random random) {
        List<IndexedMaterial> out = new ArrayList<>(curves / 3);
        long sampleId = 1;
        for (int m = 0; m < curves / 3; m++) {
            String look = LOOKS[random.nextInt(LOOKS.length)];
            String kind = KINDS[random.nextInt(KINDS.length)];
            String name = look + " " + kind + " FH-" + (10000 + m);
            List<SampleInfo> samples = new ArrayList<>();
            for (int s = 0; s < 3; s++) {
                double mm = Math.round((0.1 + random.nextDouble() * 9.9) * 10) / 10.0;
                samples.add(new SampleInfo(sampleId++, m + 1, mm, Geometry.values()[random.nextInt(2)],
                        Provenance.values()[random.nextInt(Provenance.values().length)], "bench spectrometer " + (1 + s),
                        null, "L-" + random.nextInt(10000), "illustrative " + look + " offcut", 1e-3));
            }
            Map<Long, SpectralSummary> summaries = new java.util.HashMap<>();
            samples.forEach(sample -> summaries.put(sample.id(), summary(random)));
            out.add(new IndexedMaterial(new Material(m + 1, "fh-" + m, name, MaterialClass.of(MaterialClass.KNOWN.get(random.nextInt(MaterialClass.KNOWN.size()))),
                    "Illustrative " + kind + " kept at the Fernhollow Print & Cure Workshop.",
                    List.of(TAGS[random.nextInt(TAGS.length)], TAGS[random.nextInt(TAGS.length)]), Scaling.BULK,
                    new ConstantIndex(1.49), samples), summaries));
        }
        return out;
    }
}

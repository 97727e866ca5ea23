package org.spectralsieve.search.text;

import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.Arrays;
import java.util.List;
import java.util.Locale;
import java.util.UUID;
import java.util.stream.Stream;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.spectralsieve.ingest.Checksums;
import org.spectralsieve.library.Geometry;
import org.spectralsieve.library.JooqLibraryRepository;
import org.spectralsieve.library.JooqLibraryRevisions;
import org.spectralsieve.library.MaterialClass;
import org.spectralsieve.library.NewMaterial;
import org.spectralsieve.library.NewSample;
import org.spectralsieve.library.Provenance;
import org.spectralsieve.library.Scaling;
import org.spectralsieve.library.StatedThicknesses;
import org.spectralsieve.optics.ConstantIndex;
import org.spectralsieve.spectrum.Curve;

/**
 * What keeping the text index on disk saves: on a synthetic library of illustrative materials (one sample
 * each), the first search's whole rebuild, a restart's first search (open, checksum pass, no rebuild), and a
 * search right after a one-material change (update from the change log) against a plain search. Prints
 * {@code BENCH text-index-disk materials=… rebuild_ms=… reopen_ms=… after_change_p50_ms=… query_p50_ms=…
 * bytes_per_material=…}. {@code -Dbench.textIndexMaterials=N} (default 20000).
 */
class TextIndexOnDiskBenchmark {

    private static final String[] WORDS = {"acrylic", "polycarbonate", "polyester", "glass", "quartz", "diffuser",
            "tinted", "clear", "cast", "extruded"};

    @TempDir
    Path work;

    @Test
    void rebuildReopenAndUpdate() throws Exception {
        int n = Integer.getInteger("bench.textIndexMaterials", 20_000);
        TextIndexFixture fixture = new TextIndexFixture(
                TextIndexFixture.migrated("jdbc:h2:mem:" + UUID.randomUUID() + ";DB_CLOSE_DELAY=-1"));
        JooqLibraryRepository library = fixture.library();
        JooqLibraryRevisions revisions = fixture.revisions();
        List<Long> ids = new ArrayList<>();
        for (int i = 0; i < n; i++) {
            String name = "Fernhollow " + WORDS[i % WORDS.length] + " " + WORDS[(i / 10) % WORDS.length] + " stock " + i;
            long id = library.insertMaterial(new NewMaterial("bench-" + i, name,
                    MaterialClass.of(i % 3 == 0 ? "film" : "plastic sheet"), "Illustrative synthetic stock", List.of(),
                    Scaling.BULK, new ConstantIndex(1.5), new StatedThicknesses(List.of(), Double.NaN, Double.NaN)));
            byte[] bytes = ("synthetic " + i).getBytes(StandardCharsets.UTF_8);
            library.insertSample(id, new NewSample(0.5 + i % 10, Geometry.REGULAR, Provenance.MODELLED, "", null, "", "",
                    1e-3, Curve.of(new double[] {300, 400}, new double[] {0.3, 0.8}, 1e-3), "s.csv", Checksums.sha256(bytes)));
            ids.add(id);
        }
        Path folder = work.resolve("index");
        LibraryQuery query = LibraryQuery.words("acryl", 20);

        LibraryTextSearch first = new LibraryTextSearch(library, folder);
        long t0 = System.nanoTime();
        first.search(query);
        double rebuildMs = (System.nanoTime() - t0) / 1e6;
        first.close();

        LibraryTextSearch search = new LibraryTextSearch(library, folder);
        t0 = System.nanoTime();
        search.search(query);
        double reopenMs = (System.nanoTime() - t0) / 1e6;

        int rounds = 60;
        double[] plain = new double[rounds];
        double[] afterChange = new double[rounds];
        for (int r = 0; r < rounds; r++) {
            long t = System.nanoTime();
            search.search(query);
            plain[r] = (System.nanoTime() - t) / 1e6;
            long id = ids.get((r * 7919) % ids.size());
            revisions.setRetired(JooqLibraryRevisions.Kind.MATERIAL, id, r % 2 == 0);
            t = System.nanoTime();
            search.search(query);
            afterChange[r] = (System.nanoTime() - t) / 1e6;
        }
        search.close();
        long bytes;
        try (Stream<Path> files = Files.list(folder)) {
            bytes = files.mapToLong(p -> p.toFile().length()).sum();
        }
        System.out.println(String.format(Locale.ROOT,
                "BENCH text-index-disk materials=%d rebuild_ms=%.0f reopen_ms=%.0f after_change_p50_ms=%.2f query_p50_ms=%.2f"
                        + " bytes_per_material=%d", n, rebuildMs, reopenMs, median(afterChange), median(plain), bytes / n));
    }

    private static double median(double[] values) {
        double[] sorted = values.clone();
        Arrays.sort(sorted);
        return sorted[sorted.length / 2];
    }
}

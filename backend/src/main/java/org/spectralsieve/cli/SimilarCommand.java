package org.spectralsieve.cli;

import java.util.List;
import java.util.Locale;
import java.util.concurrent.Callable;
import org.spectralsieve.search.SimilarSamples;
import org.spectralsieve.similarity.ShapeMetric;
import org.spectralsieve.similarity.SimilarHit;
import org.springframework.context.ConfigurableApplicationContext;
import picocli.CommandLine.Command;
import picocli.CommandLine.Mixin;
import picocli.CommandLine.Model.CommandSpec;
import picocli.CommandLine.Option;
import picocli.CommandLine.ParameterException;
import picocli.CommandLine.Spec;

/**
 * {@code similar --sample ID}: the stored samples whose curves look most like this sample's, nearest first, as
 * {@code GET /api/samples/{id}/similar} answers (docs/similar-curves.md).
 */
@Command(name = "similar", description = "List the stored samples whose curves look most like one sample's: material,"
        + " sample, thickness, distance, points compared, the band differing most, the thickness that matches best.")
final class SimilarCommand implements Callable<Integer> {

    @Spec
    CommandSpec spec;

    @Mixin
    DatabaseOption database;

    @Option(names = "--sample", required = true, paramLabel = "ID", description = "Sample id (see search and materials).")
    long sampleId;

    @Option(names = "--limit", paramLabel = "N", description = "How many hits, 1 to " + SimilarSamples.MAX_LIMIT
            + " (default " + SimilarSamples.DEFAULT_LIMIT + ").")
    int limit = SimilarSamples.DEFAULT_LIMIT;

    @Option(names = "--metric", paramLabel = "METRIC", description = "correlation or centred-euclidean (default:"
            + " centred-euclidean; correlation when the thickness does not matter).")
    String metric;

    @Override
    public Integer call() {
        if (limit < 1 || limit > SimilarSamples.MAX_LIMIT) {
            throw new ParameterException(spec.commandLine(), "--limit: must be from 1 to " + SimilarSamples.MAX_LIMIT
                    + ", got " + limit);
        }
        ShapeMetric chosen = metric == null ? SimilarSamples.DEFAULT_METRIC : SimilarSamples.metricNamed(metric)
                .orElseThrow(() -> new ParameterException(spec.commandLine(), "--metric: must be one of "
                        + String.join(", ", SimilarSamples.METRIC_NAMES) + ", got '" + metric + "'"));
        List<SimilarSamples.Hit> hits;
        try (ConfigurableApplicationContext context = LibraryContext.start(database.url)) {
            hits = context.getBean(SimilarSamples.class).similarTo(sampleId, chosen, limit);
        }
        TextTable table = new TextTable(List.of(">material", "name", "class", ">sample", ">mm", ">distance",
                ">points", ">resolved", "differing most", ">matches at mm"));
        for (SimilarSamples.Hit h : hits) {
            SimilarHit s = h.similarity();
            table.add(List.of(String.valueOf(h.materialId()), h.materialName(), h.materialClass(),
                    String.valueOf(h.sampleId()), Numbers.mm(h.thicknessMm()), String.format(Locale.ROOT, "%.4f", s.distance()),
                    String.valueOf(s.pointsCompared()), String.valueOf(s.resolvedPointsCompared()),
                    Numbers.mm(s.differingMost().fromNm()) + "–" + Numbers.mm(s.differingMost().toNm()) + " nm",
                    s.matchingThicknessMm().isPresent() ? Numbers.mm(s.matchingThicknessMm().getAsDouble()) : Numbers.NONE));
        }
        spec.commandLine().getOut().println("metric: " + SimilarSamples.metricName(chosen));
        table.print(spec.commandLine().getOut());
        return SieveCli.OK;
    }
}

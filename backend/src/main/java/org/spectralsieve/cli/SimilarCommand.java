package org.spectralsieve.cli;

import java.io.IOException;
import java.io.PrintWriter;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import java.util.Locale;
import java.util.Optional;
import java.util.Set;
import java.util.concurrent.Callable;
import org.spectralsieve.importers.ImportException;
import org.spectralsieve.ingest.FilePreview;
import org.spectralsieve.ingest.ImportLimitException;
import org.spectralsieve.ingest.ImportOptions;
import org.spectralsieve.ingest.ImportRequestException;
import org.spectralsieve.ingest.ImportService;
import org.spectralsieve.ingest.IngestException;
import org.spectralsieve.library.NotFoundException;
import org.spectralsieve.optics.PhysicalRanges;
import org.spectralsieve.requirement.Requirement;
import org.spectralsieve.requirement.RequirementSyntaxException;
import org.spectralsieve.search.LayerResolutionException;
import org.spectralsieve.search.SearchService;
import org.spectralsieve.search.SimilarQuestions;
import org.spectralsieve.search.SimilarSamples;
import org.spectralsieve.search.WordedSearch;
import org.spectralsieve.search.text.LibraryTextSearch;
import org.spectralsieve.similarity.ComparedBand;
import org.spectralsieve.similarity.ShapeMetric;
import org.spectralsieve.similarity.SimilarHit;
import org.spectralsieve.weighting.SpectrumLookup;
import org.springframework.context.ConfigurableApplicationContext;
import picocli.CommandLine.Command;
import picocli.CommandLine.Mixin;
import picocli.CommandLine.Model.CommandSpec;
import picocli.CommandLine.Option;
import picocli.CommandLine.ParameterException;
import picocli.CommandLine.Spec;

/**
 * {@code similar --sample ID} or {@code similar --file F}: the stored samples whose curves look most like a
 * sample's or an unsaved file's, nearest first, optionally over a band and filtered by a requirement, as
 * {@code GET /api/samples/{id}/similar} and {@code POST /api/similar} answer (docs/similar-curves.md).
 */
@Command(name = "similar", description = "List the stored samples whose curves look most like one sample's or an"
        + " unsaved file's: material, sample, thickness, distance, points compared, the band differing most, the"
        + " thickness that matches best. With --requirement, only samples of materials that also meet it.")
final class SimilarCommand implements Callable<Integer> {

    @Spec
    CommandSpec spec;

    @Mixin
    DatabaseOption database;

    @Option(names = "--sample", paramLabel = "ID", description = "Sample id (see search and materials); or --file.")
    Long sampleId;

    @Option(names = "--file", paramLabel = "FILE", description = "A curve file, read as preview reads it and never"
            + " stored; or --sample.")
    Path file;

    @Option(names = "--thickness", paramLabel = "MM", description = "--file: the piece's thickness in mm; it is then"
            + " compared as a bulk material (absorbance per mm) unless --fixed.")
    Double thicknessMm;

    @Option(names = "--fixed", description = "--file: compare the piece as measured (a coating or laminate), not per mm."
            + " The default without --thickness.")
    boolean fixed;

    @Option(names = "--band", paramLabel = "FROM-TO", description = "Compare only inside this band, nm, e.g. 300-400"
            + " (inside 200-700, at least 45 nm wide; default the whole 200-700 nm).")
    String band;

    @Option(names = "--requirement", paramLabel = "TEXT", description = "Find a substitute: keep only samples of"
            + " materials that also meet this requirement (as search takes it, words about the stock included), among the "
            + SimilarQuestions.SUBSTITUTE_POOL + " nearest curves.")
    String requirementText;

    @Option(names = "--limit", paramLabel = "N", description = "How many hits, 1 to " + SimilarSamples.MAX_LIMIT
            + " (default " + SimilarSamples.DEFAULT_LIMIT + ").")
    int limit = SimilarSamples.DEFAULT_LIMIT;

    @Option(names = "--metric", paramLabel = "METRIC", description = "correlation or centred-euclidean (default:"
            + " centred-euclidean when the thickness is known; correlation when it does not matter or is unknown).")
    String metric;

    @Mixin
    FileReadingOptions reading;

    @Override
    public Integer call() {
        if ((sampleId == null) == (file == null)) {
            throw usage("give either --sample ID or --file FILE, not " + (file == null ? "neither" : "both"));
        }
        if (limit < 1 || limit > SimilarSamples.MAX_LIMIT) {
            throw usage("--limit: must be from 1 to " + SimilarSamples.MAX_LIMIT + ", got " + limit);
        }
        ShapeMetric named = metric == null ? null : SimilarSamples.metricNamed(metric).orElseThrow(() -> usage(
                "--metric: must be one of " + String.join(", ", SimilarSamples.METRIC_NAMES) + ", got '" + metric + "'"));
        Optional<ComparedBand> asked = band();
        if (sampleId != null && (thicknessMm != null || fixed)) {
            throw usage((thicknessMm != null ? "--thickness" : "--fixed") + ": a stored sample is compared at its own"
                    + " thickness and scaling; this describes a --file piece");
        }
        if (thicknessMm != null && !PhysicalRanges.isThicknessMm(thicknessMm)) {
            throw usage("--thickness: must be from " + PhysicalRanges.MIN_THICKNESS_MM + " mm to "
                    + (long) PhysicalRanges.MAX_THICKNESS_MM + " mm, got " + thicknessMm);
        }
        ImportOptions options = null;
        byte[] bytes = null;
        if (file != null) {
            options = readingOptions();
            bytes = read(file);
        }
        preParse(requirementText);
        SimilarQuestions.Answer answer;
        try (ConfigurableApplicationContext context = LibraryContext.start(database.url)) {
            SimilarQuestions questions = context.getBean(SimilarQuestions.class);
            SimilarQuestions.Query query = file == null ? questions.sample(sampleId)
                    : fileQuery(context.getBean(ImportService.class), options, bytes);
            ShapeMetric chosen = named == null ? SimilarQuestions.defaultMetric(query) : named;
            if (!SimilarQuestions.canRank(query, chosen)) {
                throw usage("--metric: " + SimilarSamples.metricName(chosen) + " compares absorbance at the query's"
                        + " thickness: give --thickness, or use correlation");
            }
            // read as search reads it: words and terms about the stock beside the clauses narrow the substitutes
            SearchService search = context.getBean(SearchService.class);
            WordedSearch worded = new WordedSearch(search, context.getBean(LibraryTextSearch.class));
            Optional<WordedSearch.Read> read = requirementText == null || requirementText.isBlank() ? Optional.empty()
                    : Optional.of(read(worded, requirementText, context.getBean(SpectrumLookup.class),
                    search.materialClasses()));
            Optional<Requirement> requirement = read.map(WordedSearch.Read::requirement);
            Optional<Set<Long>> admitted = read.flatMap(worded::admitted);
            answer = questions.ask(query, chosen, asked, limit, requirement,
                    requirement.isPresent() ? requirementText.strip() : null, admitted);
        } catch (NotFoundException e) {
            throw new CliFailure(SieveCli.FAILED, e.getMessage());
        } catch (LayerResolutionException e) {
            throw new CliFailure(SieveCli.USAGE, "layer not resolved: " + e.getMessage());
        }
        print(spec.commandLine().getOut(), answer);
        return SieveCli.OK;
    }

    private ParameterException usage(String message) {
        return new ParameterException(spec.commandLine(), message);
    }

    private Optional<ComparedBand> band() {
        if (band == null || band.isBlank()) {
            return Optional.empty();
        }
        try {
            return Optional.of(ComparedBand.parse(band));
        } catch (IllegalArgumentException e) {
            throw usage("--band: " + e.getMessage());
        }
    }

    private ImportOptions readingOptions() {
        try {
            return reading.options(false);
        } catch (ImportRequestException e) {
            throw usage(FileReadingOptions.option(e));
        }
    }

    private byte[] read(Path path) {
        if (!Files.isRegularFile(path)) {
            throw usage("--file: '" + path + "' is not a file");
        }
        try {
            return Files.readAllBytes(path);
        } catch (IOException e) {
            throw new CliFailure(SieveCli.FAILED, "cannot read " + path + ": " + e.getMessage());
        }
    }

    /** The file read by the library's import service, as {@code POST /api/similar} reads it (same limits). */
    private SimilarQuestions.Query fileQuery(ImportService imports, ImportOptions options, byte[] bytes) {
        FilePreview p;
        try {
            p = imports.preview(String.valueOf(file.getFileName()), bytes, options);
        } catch (ImportException | IngestException | ImportLimitException e) {
            throw new CliFailure(SieveCli.FAILED, "cannot read the file: " + e.getMessage());
        } catch (ImportRequestException e) {
            throw new CliFailure(SieveCli.FAILED, "cannot read the file: " + FileReadingOptions.option(e));
        }
        return SimilarQuestions.file(p.fileName(), p.curve(), thicknessMm, thicknessMm == null ? null : !fixed,
                p.warnings());
    }

    /** Read before the database opens, so a typo costs no start-up time (exactly as search does). */
    private static void preParse(String text) {
        if (text == null || text.isBlank()) {
            return;
        }
        SearchCommand.preParse(text);
    }

    private static WordedSearch.Read read(WordedSearch worded, String text, SpectrumLookup spectra, List<String> classes) {
        try {
            return worded.read(text, spectra, classes);
        } catch (RequirementSyntaxException e) {
            throw new CliFailure(SieveCli.USAGE, RequirementErrorReport.lines(text, e));
        }
    }

    /** ", among the 7 materials its words admit" — nothing when the requirement has no words. */
    private static String admittedNote(Integer admitted) {
        if (admitted == null) {
            return "";
        }
        return admitted == 0 ? ", among no material: its words admit none of the library"
                : ", among the " + admitted + (admitted == 1 ? " material" : " materials") + " its words admit";
    }

    /**
     * The metric (and band) line, the table of hits, then what the reader should know: the requirement's
     * count and the warnings. The first two lines are the same for every question.
     */
    static void print(PrintWriter out, SimilarQuestions.Answer answer) {
        out.println("metric: " + SimilarSamples.metricName(answer.metric())
                + answer.band().map(b -> ", band: " + b).orElse(""));
        TextTable table = new TextTable(List.of(">material", "name", "class", ">sample", ">mm", ">distance",
                ">points", ">resolved", "differing most", ">matches at mm"));
        for (SimilarSamples.Hit h : answer.hits()) {
            SimilarHit s = h.similarity();
            table.add(List.of(String.valueOf(h.materialId()), h.materialName(), h.materialClass(),
                    String.valueOf(h.sampleId()), Numbers.mm(h.thicknessMm()), String.format(Locale.ROOT, "%.4f", s.distance()),
                    String.valueOf(s.pointsCompared()), String.valueOf(s.resolvedPointsCompared()),
                    Numbers.mm(s.differingMost().fromNm()) + "–" + Numbers.mm(s.differingMost().toNm()) + " nm",
                    s.matchingThicknessMm().isPresent() ? Numbers.mm(s.matchingThicknessMm().getAsDouble()) : Numbers.NONE));
        }
        table.print(out);
        answer.requirement().ifPresent(r -> out.println("requirement: " + r.met() + " of the " + r.looked()
                + " nearest curves belong to a material that meets '" + r.text() + "'" + admittedNote(r.admitted())));
        answer.warnings().forEach(w -> out.println("note: " + w));
        out.flush();
    }
}

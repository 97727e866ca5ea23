package org.spectralsieve.cli;

import java.util.ArrayList;
import java.util.Arrays;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.concurrent.Callable;
import org.spectralsieve.api.ShortlistJson;
import org.spectralsieve.library.Provenance;
import org.spectralsieve.library.UnusableRecordException;
import org.spectralsieve.optics.UnusableIndexException;
import org.spectralsieve.presets.PresetView;
import org.spectralsieve.requirement.ClauseResult;
import org.spectralsieve.requirement.RankedRow;
import org.spectralsieve.requirement.RequirementParser;
import org.spectralsieve.requirement.RequirementSyntaxException;
import org.spectralsieve.requirement.RequirementTooLargeException;
import org.spectralsieve.requirement.RequirementWords;
import org.spectralsieve.requirement.SampleEvaluation;
import org.spectralsieve.requirement.Standing;
import org.spectralsieve.requirement.ThicknessSpec;
import org.spectralsieve.search.LayerResolutionException;
import org.spectralsieve.search.SearchService;
import org.spectralsieve.search.Shortlist;
import org.spectralsieve.search.WordedSearch;
import org.spectralsieve.weighting.SpectrumLookup;
import picocli.CommandLine.Command;
import picocli.CommandLine.Mixin;
import picocli.CommandLine.Model.CommandSpec;
import picocli.CommandLine.Option;
import picocli.CommandLine.ParameterException;
import picocli.CommandLine.Parameters;
import picocli.CommandLine.Spec;
import tools.jackson.databind.json.JsonMapper;

/** {@code search REQUIREMENT}: the ranked, explained shortlist, as a table or as the API's JSON. */
@Command(name = "search", description = "Rank the library's materials against a requirement written in words,"
        + " e.g. \"passes over 80%% at 365 nm and blocks under 1%% at 405 nm, thickness 1 to 6 mm\".")
final class SearchCommand implements Callable<Integer> {

    @Spec
    CommandSpec spec;

    @Mixin
    DatabaseOption database;

    @Parameters(index = "0", arity = "0..1", paramLabel = "REQUIREMENT", description = "The requirement, quoted as one"
            + " argument; words about the stock may stand before its clauses ('acrylic passes over 80%% at 400 nm')."
            + " With --preset: further clauses or settings added to the preset's ('thickness 1 to 6 mm').")
    String requirementText;

    @Option(names = "--preset", paramLabel = "NAME", description = "Run a requirement preset (see: presets list);"
            + " a REQUIREMENT given too is added to its text after a comma.")
    String preset;

    @Option(names = "--limit", paramLabel = "N", defaultValue = "" + SearchService.DEFAULT_LIMIT,
            description = "Materials in the shortlist, 1 to " + SearchService.MAX_LIMIT + " (default: ${DEFAULT-VALUE}).")
    int limit;

    @Option(names = "--json", description = "Print the same JSON as POST /api/search instead of the table.")
    boolean json;

    @Override
    public Integer call() {
        if (limit < 1 || limit > SearchService.MAX_LIMIT) {
            throw new ParameterException(spec.commandLine(),
                    "--limit must be from 1 to " + SearchService.MAX_LIMIT + ", got " + limit);
        }
        String caution = null;
        if (preset != null) {
            PresetView chosen = PresetsCommand.find(database.url, preset);
            caution = chosen.caution();
            requirementText = combined(chosen.text(), requirementText);
            if (!json) {
                spec.commandLine().getOut().println("Preset " + chosen.name() + ": " + requirementText);
            }
        } else if (requirementText == null || requirementText.isBlank()) {
            throw new ParameterException(spec.commandLine(), "give a REQUIREMENT, or --preset NAME");
        }
        // read before the database opens, so a typo costs no start-up time; only a name that imported
        // spectra might supply waits for the library's own lookup
        preParse(requirementText);
        Shortlist shortlist;
        WordedSearch.Words words = null;
        String jsonText = null;
        // --json prints with the API's mapper, which only the Spring context configures (Jackson's modules and
        // Spring Boot's settings), so it takes the context; the table needs no mapper and may take the plain wiring
        SpringLibraryServices withMapper = json ? new SpringLibraryServices(LibraryContext.start(database.url)) : null;
        try (LibraryServices library = withMapper != null ? withMapper : LibraryContext.open(database.url)) {
            SearchService search = library.search();
            WordedSearch worded = new WordedSearch(search, library.textSearch());
            WordedSearch.Read read = read(worded, requirementText, library.spectra(),
                    search.materialClasses());
            try {
                WordedSearch.Answer answer = worded.search(read, limit);
                shortlist = answer.shortlist();
                words = answer.words().orElse(null);
            } catch (LayerResolutionException e) {
                throw new CliFailure(SieveCli.USAGE, layerProblem(e));
            } catch (UnusableRecordException | UnusableIndexException e) {
                // the part in front is a stored record that fails today's checks (docs/validation.md)
                throw new CliFailure(SieveCli.FAILED, e.getMessage());
            }
            if (json) {
                // the context's mapper, configured as the API's, so both print numbers and nulls alike
                Map<String, Object> out = new LinkedHashMap<>(ShortlistJson.toJson(shortlist));
                if (caution != null) {
                    out.putIfAbsent("caution", caution);
                }
                if (words != null) {
                    out.put("words", Map.of("text", words.text(), "provenance", words.provenances(), "admitted",
                            words.admitted()));
                }
                jsonText = withMapper.context().getBean(JsonMapper.class).writerWithDefaultPrettyPrinter().writeValueAsString(out);
            }
        }
        if (json) {
            spec.commandLine().getOut().println(jsonText);
            spec.commandLine().getOut().flush();
        } else {
            table(shortlist).print(spec.commandLine().getOut());
            if (words != null) {
                spec.commandLine().getOut().println(wordsNote(words));
            }
            notes(shortlist).forEach(spec.commandLine().getOut()::println);
            if (caution != null && ShortlistJson.caution(shortlist.requirement()).isEmpty()) {
                // a safety preset (eyewear, viewing window, enclosure) carries the caution whatever its clauses
                spec.commandLine().getOut().println("Caution: " + caution);
            }
            spec.commandLine().getOut().flush();
        }
        return SieveCli.OK;
    }

    /**
     * The preset's text with the user's extra clauses or settings after a comma: simple, and what the language
     * joins clauses and settings with; words about the stock must stand first, so they cannot be added here.
     */
    static String combined(String presetText, String extra) {
        return extra == null || extra.isBlank() ? presetText : presetText + ", " + extra.strip();
    }

    static void preParse(String text) {
        try {
            // words about the stock before the clauses are the library's to judge; the clauses are read here
            RequirementWords words = RequirementWords.split(text, PROVENANCES);
            RequirementParser.parse(words.any() ? words.maskedText() : text, SpectrumLookup.builtIn());
        } catch (RequirementTooLargeException e) {
            throw new CliFailure(SieveCli.USAGE, List.of("requirement not read: " + e.getMessage()));
        } catch (RequirementSyntaxException e) {
            if (!e.unknownSpectrum()) {
                throw new CliFailure(SieveCli.USAGE, RequirementErrorReport.lines(text, e));
            }
        }
    }

    private static final List<String> PROVENANCES = Arrays.stream(Provenance.values()).map(Provenance::label).toList();

    /** "Words: “acrylic” admitted 7 materials; the clauses were judged on those alone." */
    static String wordsNote(WordedSearch.Words words) {
        String terms = words.text().isEmpty() ? "" : "“" + words.text() + "”";
        for (String p : words.provenances()) {
            terms += (terms.isEmpty() ? "" : " and ") + "provenance " + p;
        }
        return words.admitted() == 0 ? "Words: " + terms + " admitted no material of the library; nothing was judged."
                : "Words: " + terms + " admitted " + words.admitted() + (words.admitted() == 1 ? " material" : " materials")
                + "; the clauses were judged on those alone.";
    }

    private static WordedSearch.Read read(WordedSearch worded, String text, SpectrumLookup spectra, List<String> classes) {
        try {
            return worded.read(text, spectra, classes);
        } catch (RequirementSyntaxException e) {
            throw new CliFailure(SieveCli.USAGE, RequirementErrorReport.lines(text, e));
        }
    }

    private static List<String> layerProblem(LayerResolutionException e) {
        List<String> lines = new ArrayList<>();
        lines.add("layer not resolved: " + e.getMessage());
        for (LayerResolutionException.Choice c : e.choices()) {
            lines.add("  " + c.slug() + "  " + c.name() + " (" + c.detail() + ")");
        }
        return lines;
    }

    /**
     * Under the table: the sample used as the fixed layer, the library generation the answer was computed at, and the
     * caution for safety figures.
     */
    static List<String> notes(Shortlist shortlist) {
        List<String> lines = new ArrayList<>();
        // every answer names the light it assumed (docs/oblique-incidence.md)
        String integration = shortlist.requirement().light().integration();
        lines.add("Light: " + shortlist.requirement().light().describe() + (integration.isEmpty() ? "" : "; " + integration) + ".");
        shortlist.layer().ifPresent(layer -> lines.add("Light path: every result is judged as a stack, "
                + layer.describe() + "."));
        if (shortlist.libraryGeneration() != Shortlist.UNKNOWN_GENERATION) {
            lines.add("Library generation " + shortlist.libraryGeneration() + ": each row names the sample and material"
                    + " revisions it was judged on (docs/audit.md).");
        }
        // the caution stays the last line, where a reader's eye ends
        ShortlistJson.caution(shortlist.requirement()).ifPresent(c -> lines.add("Caution: " + c));
        return lines;
    }

    static TextTable table(Shortlist shortlist) {
        // the feasible range only exists where thickness is a design variable
        boolean solving = shortlist.requirement().thickness().kind() == ThicknessSpec.Kind.RANGE;
        List<String> columns = new ArrayList<>(List.of(">rank", "material", ">sample", "geometry", ">mm", "verdict",
                ">worst margin"));
        if (solving) {
            columns.add("thickness range mm");
        }
        columns.add("binding clause");
        TextTable table = new TextTable(columns);
        String group = null;
        for (RankedRow row : shortlist.rows()) {
            // the rows come grouped (RankingOrder); each group gets the page's heading
            String rowGroup = row.evaluation().standing().group();
            if (!rowGroup.equals(group)) {
                table.heading(Standing.heading(rowGroup));
                group = rowGroup;
            }
            List<String> lines = new ArrayList<>(explanations(row.evaluation()));
            sampleUsed(shortlist, row).ifPresent(lines::add);
            revisionsUsed(shortlist, row).ifPresent(lines::add);
            table.add(cells(row, shortlist.geometry(row), solving), lines);
        }
        return table;
    }

    private static List<String> cells(RankedRow row, String geometry, boolean solving) {
        SampleEvaluation e = row.evaluation();
        List<String> cells = new ArrayList<>(List.of(String.valueOf(row.position()), row.materialName(),
                String.valueOf(e.sampleId()), geometry == null ? Numbers.NONE : geometry, Numbers.mm(e.thicknessMm()), verdict(e), margin(e)));
        if (solving) {
            cells.add(e.feasibleMm() == null ? Numbers.NONE
                    : Numbers.mm(e.feasibleMm().loMm()) + " to " + Numbers.mm(e.feasibleMm().hiMm()));
        }
        cells.add(e.bindingClauseIndex() < 0 ? Numbers.NONE : e.clauses().get(e.bindingClauseIndex()).clause().text());
        return cells;
    }

    /** "sample: measured at 3 mm" or "sample: rescaled from 2 mm" (the page's words); empty when it cannot be said. */
    static java.util.Optional<String> sampleUsed(Shortlist shortlist, RankedRow row) {
        double measured = shortlist.measuredMm(row);
        return shortlist.rescaled(row).map(rescaled -> "sample: " + (rescaled ? "rescaled from " : "measured at ")
                + Numbers.mm(measured) + " mm");
    }

    /** "revisions: sample 2, material 1": what the row was judged on, to reproduce it later; empty when not known. */
    static java.util.Optional<String> revisionsUsed(Shortlist shortlist, RankedRow row) {
        Shortlist.Revisions r = shortlist.revisions(row);
        return r == null ? java.util.Optional.empty()
                : java.util.Optional.of("revisions: sample " + r.sample() + ", material " + r.material());
    }

    private static List<String> explanations(SampleEvaluation e) {
        List<String> lines = new ArrayList<>();
        String stock = e.stockAdvice().describe();
        if (!stock.isEmpty()) {
            lines.add("stock: " + stock);
        }
        for (ClauseResult c : e.clauses()) {
            lines.add(c.verdict().name().toLowerCase(Locale.ROOT) + " · " + c.confidenceText() + ": " + c.explanation());
        }
        return lines;
    }

    /** The worst margin; "≤" when it rests on a detection-limit bound (the true miss may be larger). */
    private static String margin(SampleEvaluation e) {
        String decades = Numbers.decades(e.worstMarginDecades());
        return e.standing().marginIsBound() ? "≤ " + decades : decades;
    }

    private static String verdict(SampleEvaluation e) {
        return e.verdict().name().toLowerCase(Locale.ROOT);
    }
}

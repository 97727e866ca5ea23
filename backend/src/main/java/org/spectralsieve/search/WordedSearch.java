package org.spectralsieve.search;

import java.util.Arrays;
import java.util.Collection;
import java.util.List;
import java.util.Optional;
import java.util.Set;
import org.spectralsieve.library.Geometry;
import org.spectralsieve.library.Provenance;
import org.spectralsieve.requirement.Requirement;
import org.spectralsieve.requirement.RequirementParser;
import org.spectralsieve.requirement.RequirementSyntaxException;
import org.spectralsieve.requirement.RequirementWords;
import org.spectralsieve.search.text.LibraryQuery;
import org.spectralsieve.search.text.LibraryTextSearch;
import org.spectralsieve.weighting.SpectrumLookup;

/**
 * A requirement written with words about the stock ({@code acrylic passes over 80% at 400 nm}): the
 * library's text index admits the materials the words (and {@code provenance X}, {@code class X},
 * {@code geometry X} terms) name, then the clauses are judged on those materials alone, and the answer
 * says how many the words admitted (docs/library-search.md, "Words with a requirement"). A requirement
 * without words is read and searched exactly as {@link RequirementParser} and {@link SearchService} do.
 */
public class WordedSearch {

    /** The provenance values a term may name, as the library stores them. */
    private static final List<String> PROVENANCES = Arrays.stream(Provenance.values()).map(Provenance::label).toList();

    private final SearchService search;
    private final LibraryTextSearch text;

    public WordedSearch(SearchService search, LibraryTextSearch text) {
        this.search = search;
        this.text = text;
    }

    /** A requirement as read, with the words and terms written beside it (none: {@link RequirementWords#any} false). */
    public record Read(Requirement requirement, RequirementWords words) {
    }

    /**
     * How many materials the words admitted: {@code admitted} is 0 when they name none, and the shortlist
     * is then empty — an answer, not an error.
     */
    public record Words(String text, List<String> provenances, int admitted) {
        public Words {
            provenances = List.copyOf(provenances);
        }
    }

    /** The shortlist, and the words' share in it when words were written. */
    public record Answer(Shortlist shortlist, Optional<Words> words) {
    }

    /**
     * Reads the text: the words and terms split off, the clauses parsed in place (so an error's position is
     * one in what the user typed). A leading word that admits no material and is a slip's distance from a
     * keyword is reported as the parser reports a slip ("did you mean 'passes'?"), not searched for.
     *
     * @throws RequirementSyntaxException as {@link RequirementParser#parse(String, SpectrumLookup, Collection)}
     *                                    does, and for a provenance term naming no provenance
     */
    public Read read(String requirementText, SpectrumLookup spectra, Collection<String> materialClasses) {
        RequirementWords words = RequirementWords.split(requirementText, PROVENANCES);
        if (!words.any()) {
            return new Read(RequirementParser.parse(requirementText, spectra, materialClasses), words);
        }
        if (words.words().length() > LibraryQuery.MAX_WORDS_LENGTH) {
            throw new RequirementSyntaxException(0, "at most " + LibraryQuery.MAX_WORDS_LENGTH
                    + " characters of words before the first clause", words.words().length() + " characters", null);
        }
        for (RequirementWords.Slip slip : words.typos()) {
            if (text.admitted(LibraryQuery.words(slip.word(), 1)).isEmpty()) {
                // read from the slip on: the parser stops there with its own "did you mean"
                String fromSlip = " ".repeat(slip.start()) + requirementText.substring(slip.start());
                RequirementParser.parse(fromSlip, spectra, materialClasses);
            }
        }
        Requirement masked = RequirementParser.parse(words.maskedText(), spectra, materialClasses);
        String clauses = words.maskedText().strip().replaceAll("\\s+", " ");
        return new Read(new Requirement(masked.clauses(), masked.thickness(), masked.materialClass(), masked.geometry(),
                masked.layer(), clauses, masked.light()), words);
    }

    /** The requirement judged on the materials its words admit, or on the whole library when it has none. */
    public Answer search(Read read, int limit) {
        Requirement requirement = read.requirement();
        RequirementWords words = read.words();
        Optional<Set<Long>> admittedByWords = admitted(read);
        if (admittedByWords.isEmpty()) {
            return new Answer(search.search(requirement, limit), Optional.empty());
        }
        Set<Long> admitted = admittedByWords.get();
        Shortlist shortlist = search.search(requirement, limit, admitted);
        return new Answer(shortlist, Optional.of(new Words(words.words(), words.provenances(), admitted.size())));
    }

    /**
     * The ids of the materials the words and terms admit (with the requirement's class and geometry, as the
     * search narrows by them); empty when the text has no words, so the caller judges the whole library.
     * Shared with "find a substitute", which filters similar curves by the same narrowing.
     */
    public Optional<Set<Long>> admitted(Read read) {
        RequirementWords words = read.words();
        if (!words.any()) {
            return Optional.empty();
        }
        Requirement requirement = read.requirement();
        return Optional.of(text.admitted(new LibraryQuery(words.words(),
                requirement.materialClass().map(Set::of).orElse(Set.of()), geometries(requirement),
                words.provenances().stream().map(Provenance::parse).collect(java.util.stream.Collectors.toSet()),
                Set.of(), 1)));
    }

    /** The requirement's geometry filter as a facet choice: "any" or none chooses nothing. */
    private static Set<Geometry> geometries(Requirement requirement) {
        return requirement.geometry().filter(g -> !g.equals(Requirement.ANY_GEOMETRY)).map(Geometry::parse).map(Set::of)
                .orElse(Set.of());
    }
}

package org.spectralsieve.spectra;

import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import java.util.Objects;
import java.util.Set;
import java.util.TreeSet;
import org.slf4j.Logger;
import org.slf4j.LoggerFactory;
import org.spectralsieve.library.LibraryGeneration;
import org.spectralsieve.weighting.Emitter;
import org.spectralsieve.weighting.Response;
import org.spectralsieve.weighting.SpectrumLookup;

/**
 * Built-in emitters and responses first, then the imported ones from the database. The imported ones are
 * turned into core {@link Emitter}s and {@link Response}s once and kept (a snapshot), so that a figure
 * costs no query for them. Each use reads the library's change counter ({@link LibraryGeneration}, one
 * primary-key read) and reads the rows again when it moved, so a spectrum imported or deleted by another
 * process (the command line on a shared database, another application node) is seen at once.
 *
 * <p>Built-in names win: an imported spectrum whose name a later release gave to a built-in one is
 * left out (it can still be deleted).
 */
public final class ImportedSpectrumLookup implements SpectrumLookup {

    private static final Logger log = LoggerFactory.getLogger(ImportedSpectrumLookup.class);

    private final ReferenceSpectrumRepository repository;
    private final SpectrumLookup builtIn;
    private volatile Snapshot snapshot;

    /**
     * What the imported rows became, with the built-ins ahead of them.
     *
     * @param generation the change counter read before the rows were
     */
    private record Snapshot(List<Emitter> emitters, List<Response> responses, long generation) {
    }

    public ImportedSpectrumLookup(ReferenceSpectrumRepository repository, SpectrumLookup builtIn) {
        this.repository = Objects.requireNonNull(repository, "repository");
        this.builtIn = Objects.requireNonNull(builtIn, "builtIn");
    }

    @Override
    public List<Emitter> emitters() {
        return snapshot().emitters();
    }

    @Override
    public List<Response> responses() {
        return snapshot().responses();
    }

    // emitter(name) and response(name) search emitters() and responses(), which are current (see snapshot())

    /** The built-in catalogues alone. */
    public SpectrumLookup builtIn() {
        return builtIn;
    }

    /** True when a built-in emitter or response has this name (ignoring case): such names cannot be imported. */
    public boolean isBuiltInName(String name) {
        return builtInNames().contains(name.strip().toLowerCase(Locale.ROOT));
    }

    /** Every built-in emitter and response name, lower-case, sorted. */
    public Set<String> builtInNames() {
        Set<String> names = new TreeSet<>();
        builtIn.emitters().forEach(e -> names.add(e.name().toLowerCase(Locale.ROOT)));
        builtIn.responses().forEach(r -> names.add(r.name().toLowerCase(Locale.ROOT)));
        return names;
    }

    /** True when this emitter (or response) name belongs to a built-in of that kind. */
    public boolean isBuiltIn(SpectrumKind kind, String name) {
        return kind == SpectrumKind.EMITTER ? builtIn.emitter(name).isPresent() : builtIn.response(name).isPresent();
    }

    /**
     * Reads the imported spectra again now. Not needed after an import or delete (those raise the change
     * counter, which the next use notices); kept for a caller that wants the rows read at once.
     */
    public synchronized void refresh() {
        install(read());
    }

    /**
     * The rows as a snapshot, the counter read first: a write committed after that read is either missing
     * from the rows (and the number says so: the next use reads again) or already in them.
     */
    private Snapshot read() {
        long generation = repository.generation();
        List<Emitter> emitters = new ArrayList<>(builtIn.emitters());
        List<Response> responses = new ArrayList<>(builtIn.responses());
        for (ReferenceSpectrum s : repository.findAll()) {
            if (isBuiltIn(s.kind(), s.name())) {
                log.warn("imported {} '{}' is shadowed by the built-in of that name; delete or re-import it under"
                        + " another name", s.kind().label(), s.name());
                continue;
            }
            try {
                if (s.kind() == SpectrumKind.EMITTER) {
                    emitters.add(SpectrumConversion.emitter(s));
                } else {
                    responses.add(SpectrumConversion.response(s));
                }
            } catch (IllegalArgumentException e) {
                // checked at import, so only a row changed by hand lands here; one bad row must not stop the rest
                log.error("imported {} '{}' (id {}) cannot be used: {}", s.kind().label(), s.name(), s.id(), e.getMessage());
            }
        }
        return new Snapshot(List.copyOf(emitters), List.copyOf(responses), generation);
    }

    /** Callers hold this object's lock, so installs never interleave; an older read never replaces a newer one. */
    private void install(Snapshot read) {
        Snapshot installed = snapshot;
        if (installed == null || read.generation() >= installed.generation()) {
            snapshot = read;
        }
    }

    /** The installed snapshot if it is as new as the database, else a fresh read (one read for concurrent callers). */
    private Snapshot snapshot() {
        long generation = repository.generation();
        Snapshot s = snapshot;
        if (s != null && s.generation() >= generation) {
            return s;
        }
        synchronized (this) {
            s = snapshot;
            if (s == null || s.generation() < generation) {
                install(read());
                s = snapshot;
            }
            return s;
        }
    }
}

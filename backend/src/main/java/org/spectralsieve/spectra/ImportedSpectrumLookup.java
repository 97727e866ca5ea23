package org.spectralsieve.spectra;

import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import java.util.Objects;
import java.util.Optional;
import java.util.Set;
import java.util.TreeSet;
import org.slf4j.Logger;
import org.slf4j.LoggerFactory;
import org.spectralsieve.weighting.Emitter;
import org.spectralsieve.weighting.Response;
import org.spectralsieve.weighting.SpectrumLookup;

/**
 * Built-in emitters and responses first, then the imported ones from the database. The imported ones are
 * turned into core {@link Emitter}s and {@link Response}s once and kept (a snapshot), read on first use
 * and again after each import or delete ({@link #refresh()}), so that a figure never costs a query.
 *
 * <p>Built-in names win: an imported spectrum whose name a later release gave to a built-in one is
 * left out (it can still be deleted). A name that is not found triggers one reload before the answer
 * "unknown", so a spectrum imported by another process (the command line on a shared database) is
 * found too.
 */
public final class ImportedSpectrumLookup implements SpectrumLookup {

    private static final Logger log = LoggerFactory.getLogger(ImportedSpectrumLookup.class);

    private final ReferenceSpectrumRepository repository;
    private final SpectrumLookup builtIn;
    private volatile Snapshot snapshot;

    /** What the imported rows became, with the built-ins ahead of them. */
    private record Snapshot(List<Emitter> emitters, List<Response> responses) {
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

    @Override
    public Optional<Emitter> emitter(String name) {
        Optional<Emitter> hit = SpectrumLookup.super.emitter(name);
        if (hit.isEmpty()) {
            refresh();
            hit = SpectrumLookup.super.emitter(name);
        }
        return hit;
    }

    @Override
    public Optional<Response> response(String name) {
        Optional<Response> hit = SpectrumLookup.super.response(name);
        if (hit.isEmpty()) {
            refresh();
            hit = SpectrumLookup.super.response(name);
        }
        return hit;
    }

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

    /** Reads the imported spectra again; call after every committed import or delete. */
    public synchronized void refresh() {
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
        snapshot = new Snapshot(List.copyOf(emitters), List.copyOf(responses));
    }

    private Snapshot snapshot() {
        Snapshot s = snapshot;
        if (s == null) {
            refresh();
            s = snapshot;
        }
        return s;
    }
}

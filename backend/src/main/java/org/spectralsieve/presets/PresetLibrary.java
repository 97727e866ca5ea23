package org.spectralsieve.presets;

import java.time.Instant;
import java.util.ArrayList;
import java.util.List;
import java.util.Map;
import java.util.Optional;
import org.spectralsieve.library.FieldException;
import tools.jackson.databind.JsonNode;

/**
 * Every way in (API, command line) asks here: the catalogue and the stored presets together, seen and changed as
 * {@link PresetCaller} allows. A preset is named by its key: a stored preset's id, or a name looked up among the
 * caller's own first, then the shared ones, then the catalogue. Built-in names are kept for the catalogue, so a name
 * in a link never means two things to one user.
 */
public final class PresetLibrary {

    private final PresetCatalogue catalogue;
    private final PresetStore store;
    private final PresetDraft.TextReader reader;

    /** @param reader reads a requirement text as a search would (with the library's spectra and classes) */
    public PresetLibrary(PresetCatalogue catalogue, PresetStore store, PresetDraft.TextReader reader) {
        this.catalogue = catalogue;
        this.store = store;
        this.reader = reader;
    }

    /** A built-in preset by name, without the library (its names are never a stored preset's). */
    public static Optional<PresetView> builtIn(String name) {
        return name == null ? Optional.empty() : PresetCatalogue.builtIn().find(name).map(PresetView::of);
    }

    public PresetCatalogue catalogue() {
        return catalogue;
    }

    /** The catalogue, then the shared presets, then the caller's own (embedded: the catalogue, then the user's). */
    public List<PresetView> list(PresetCaller caller) {
        List<PresetView> all = new ArrayList<>();
        catalogue.presets().forEach(p -> all.add(PresetView.of(p)));
        List<SavedPreset> saved = store.visibleTo(caller);
        saved.stream().filter(p -> caller.origin(p).equals(PresetView.SHARED)).forEach(p -> all.add(PresetView.of(p, PresetView.SHARED)));
        saved.stream().filter(p -> caller.origin(p).equals(PresetView.MINE)).forEach(p -> all.add(PresetView.of(p, PresetView.MINE)));
        return all;
    }

    /** By id or name; not found also for what exists but the caller may not see. */
    public PresetView find(PresetCaller caller, String key) {
        String k = key == null ? "" : key.strip();
        if (k.isEmpty() || k.length() > PresetDraft.MAX_NAME) {
            throw new PresetNotFoundException(k.length() > PresetDraft.MAX_NAME ? k.substring(0, PresetDraft.MAX_NAME) + "…" : k);
        }
        Optional<SavedPreset> byId = asId(k).flatMap(store::live).filter(caller::sees);
        if (byId.isPresent()) {
            return PresetView.of(byId.get(), caller.origin(byId.get()));
        }
        if (!caller.embedded()) {
            Optional<SavedPreset> own = store.liveByName(caller.accountId(), k);
            if (own.isPresent()) {
                return PresetView.of(own.get(), PresetView.MINE);
            }
        }
        Optional<SavedPreset> shared = store.liveByName(null, k);
        if (shared.isPresent()) {
            return PresetView.of(shared.get(), caller.origin(shared.get()));
        }
        return catalogue.find(k).map(PresetView::of).orElseThrow(() -> new PresetNotFoundException(k));
    }

    /** Saves a new preset: the caller's own, or (admins, {@code shared}) everyone's. */
    public PresetView create(PresetCaller caller, PresetDraft draft, boolean shared) {
        Long owner = caller.ownerOfNew(shared);
        PresetDraft checked = notBuiltIn(draft.checked("", reader), "name");
        SavedPreset p = store.create(owner, checked);
        return PresetView.of(p, caller.origin(p));
    }

    public PresetView edit(PresetCaller caller, String key, PresetDraft draft) {
        SavedPreset p = changeable(caller, key);
        PresetDraft checked = notBuiltIn(draft.checked("", reader), "name");
        SavedPreset after = store.edit(p.id(), checked);
        return PresetView.of(after, caller.origin(after));
    }

    /** Deleting is retiring: the preset leaves every list and its name is free; the row stays. */
    public PresetView retire(PresetCaller caller, String key) {
        SavedPreset p = changeable(caller, key);
        SavedPreset after = store.retire(p.id());
        return PresetView.of(after, caller.origin(after));
    }

    /** The caller's own presets as a {@link PresetFile} (embedded: the user's; {@code shared}: everyone's). */
    public Map<String, Object> export(PresetCaller caller, boolean shared) {
        Long owner = caller.embedded() || shared ? null : caller.accountId();
        return PresetFile.write(store.ownedBy(owner), Instant.now());
    }

    /** Reads a {@link PresetFile} and stores every entry as the caller's own (or shared), all or nothing. */
    public List<PresetView> importFile(PresetCaller caller, JsonNode file, boolean shared) {
        Long owner = caller.ownerOfNew(shared);
        List<PresetDraft> drafts = PresetFile.read(file, reader);
        for (int i = 0; i < drafts.size(); i++) {
            notBuiltIn(drafts.get(i), "presets[" + i + "].name");
        }
        return store.createAll(owner, drafts, "presets").stream().map(p -> PresetView.of(p, caller.origin(p))).toList();
    }

    /** A stored preset the caller may change; the catalogue's are read-only, others' private ones not found. */
    private SavedPreset changeable(PresetCaller caller, String key) {
        PresetView seen = find(caller, key);
        if (seen.id() == null) {
            throw new PresetRefusedException("preset '" + seen.name() + "' is built in and read-only; save a copy"
                    + " under a name of your own to change it", null);
        }
        SavedPreset p = store.live(seen.id()).orElseThrow(() -> new PresetNotFoundException(key));
        caller.mayChange(p);
        return p;
    }

    /** Words of the API's own paths under /api/presets: a preset so named could not be read by name there. */
    private static final java.util.Set<String> RESERVED = java.util.Set.of("export", "import");

    private PresetDraft notBuiltIn(PresetDraft draft, String field) {
        if (RESERVED.contains(PresetDraft.nameKey(draft.name()))) {
            throw new FieldException(field, "'" + draft.name() + "' is reserved for the API's own addresses; choose another");
        }
        if (catalogue.holds(draft.name())) {
            throw new FieldException(field, "'" + draft.name() + "' is the name of a built-in preset; choose another");
        }
        return draft;
    }

    private static Optional<Long> asId(String key) {
        if (!key.matches("[0-9]{1,18}")) {
            return Optional.empty();
        }
        return Optional.of(Long.parseLong(key));
    }
}

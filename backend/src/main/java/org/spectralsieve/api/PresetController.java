package org.spectralsieve.api;

import java.util.List;
import java.util.Map;
import org.spectralsieve.accounts.Role;
import org.spectralsieve.accounts.SignedIn;
import org.spectralsieve.presets.PresetCaller;
import org.spectralsieve.presets.PresetDraft;
import org.spectralsieve.presets.PresetLibrary;
import org.spectralsieve.presets.PresetRefusedException;
import org.spectralsieve.presets.PresetView;
import org.springframework.beans.factory.annotation.Value;
import org.springframework.http.HttpHeaders;
import org.springframework.http.HttpStatus;
import org.springframework.http.ResponseEntity;
import org.springframework.security.core.context.SecurityContextHolder;
import org.springframework.web.bind.annotation.DeleteMapping;
import org.springframework.web.bind.annotation.GetMapping;
import org.springframework.web.bind.annotation.PathVariable;
import org.springframework.web.bind.annotation.PostMapping;
import org.springframework.web.bind.annotation.PutMapping;
import org.springframework.web.bind.annotation.RequestBody;
import org.springframework.web.bind.annotation.RequestMapping;
import org.springframework.web.bind.annotation.RequestParam;
import org.springframework.web.bind.annotation.ResponseStatus;
import org.springframework.web.bind.annotation.RestController;
import tools.jackson.databind.JsonNode;

/**
 * {@code /api/presets}: the built-in catalogue, the shared presets and the caller's own (docs/presets.md). Who may
 * change what is {@link PresetCaller}'s rule; in server mode every endpoint here is open to viewers in
 * {@code EndpointRoles}, and a change to a shared preset is refused here unless the caller is an admin.
 */
@RestController
@RequestMapping("/api/presets")
class PresetController {

    private final PresetLibrary presets;
    private final boolean serverMode;

    PresetController(PresetLibrary presets, @Value("${sieve.server-mode:false}") boolean serverMode) {
        this.presets = presets;
        this.serverMode = serverMode;
    }

    /** The body of a new or edited preset; {@code shared} asks for one that belongs to everyone (admins). */
    record PresetBody(String name, String text, String note, Boolean shared) {
    }

    @GetMapping
    Map<String, Object> list() {
        return Map.of("presets", presets.list(caller()).stream().map(PresetController::json).toList());
    }

    @GetMapping("/export")
    ResponseEntity<Map<String, Object>> export(@RequestParam(name = "shared", defaultValue = "false") boolean shared) {
        return ResponseEntity.ok()
                .header(HttpHeaders.CONTENT_DISPOSITION, "attachment; filename=\"spectral-sieve-presets.json\"")
                .body(presets.export(caller(), shared));
    }

    @GetMapping("/{key}")
    Map<String, Object> get(@PathVariable String key) {
        return json(presets.find(caller(), key));
    }

    @PostMapping
    @ResponseStatus(HttpStatus.CREATED)
    Map<String, Object> create(@RequestBody PresetBody body) {
        PresetBody b = bodyOrRefuse(body);
        return json(presets.create(caller(), new PresetDraft(b.name(), b.text(), b.note()), Boolean.TRUE.equals(b.shared())));
    }

    @PutMapping("/{key}")
    Map<String, Object> edit(@PathVariable String key, @RequestBody PresetBody body) {
        PresetBody b = bodyOrRefuse(body);
        PresetCaller caller = caller();
        if (b.shared() != null && !caller.embedded()) {
            // found first, so someone else's private preset is "not found" here too, whatever the body says
            boolean shared = PresetView.SHARED.equals(presets.find(caller, key).origin());
            if (b.shared() != shared) {
                throw new BadParameterException("shared", "who a preset belongs to is set when it is saved; save a"
                        + " copy instead");
            }
        }
        return json(presets.edit(caller, key, new PresetDraft(b.name(), b.text(), b.note())));
    }

    /** Deleting retires: gone from every list, kept in the library (nothing is hard-deleted). */
    @DeleteMapping("/{key}")
    Map<String, Object> delete(@PathVariable String key) {
        return json(presets.retire(caller(), key));
    }

    /** A presets file (the export's format) in the body; every entry is stored, or none. */
    @PostMapping("/import")
    @ResponseStatus(HttpStatus.CREATED)
    Map<String, Object> importFile(@RequestBody JsonNode file,
                                   @RequestParam(name = "shared", defaultValue = "false") boolean shared) {
        List<PresetView> stored = presets.importFile(caller(), file, shared);
        return Map.of("imported", stored.size(), "presets", stored.stream().map(PresetController::json).toList());
    }

    private static PresetBody bodyOrRefuse(PresetBody body) {
        if (body == null) {
            throw new BadParameterException("name", "give the preset as {\"name\": …, \"text\": …, \"note\": …}");
        }
        return body;
    }

    /** The embedded tool's single user, or the signed-in account (the security chain admits no one else). */
    private PresetCaller caller() {
        if (!serverMode) {
            return PresetCaller.LOCAL;
        }
        if (SecurityContextHolder.getContext().getAuthentication() instanceof SignedIn signedIn) {
            return PresetCaller.account(signedIn.account().id(), signedIn.account().role().includes(Role.ADMIN));
        }
        throw new PresetRefusedException("sign in first", Role.VIEWER.label());
    }

    static Map<String, Object> json(PresetView p) {
        Map<String, Object> json = new java.util.LinkedHashMap<>();
        json.put("origin", p.origin());
        json.put("id", p.id());
        json.put("key", p.key());
        json.put("name", p.name());
        json.put("title", p.title());
        json.put("text", p.text());
        json.put("reason", p.reason());
        json.put("source", p.source());
        json.put("job", p.job());
        json.put("safety", p.safety());
        json.put("caution", p.caution());
        json.put("note", p.note());
        json.put("link", p.link());
        json.put("createdAt", p.createdAt() == null ? null : p.createdAt().toString());
        json.put("updatedAt", p.updatedAt() == null ? null : p.updatedAt().toString());
        return json;
    }
}

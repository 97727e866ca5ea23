package org.spectralsieve.api;

import static org.assertj.core.api.Assertions.assertThat;

import java.net.URI;
import java.net.http.HttpClient;
import java.net.http.HttpRequest;
import java.net.http.HttpResponse;
import java.util.List;
import org.junit.jupiter.api.Test;
import org.spectralsieve.weighting.SafetyCaution;
import org.springframework.boot.test.context.SpringBootTest;
import org.springframework.boot.test.web.server.LocalServerPort;
import tools.jackson.databind.JsonNode;
import tools.jackson.databind.json.JsonMapper;
import tools.jackson.databind.node.ArrayNode;
import tools.jackson.databind.node.ObjectNode;

/**
 * {@code /api/presets} in the embedded tool: the catalogue listed beside the user's own, save, edit, delete (retire),
 * export and import, and a problem naming the field for every bad input. Names are invented (Fernhollow workshop).
 */
@SpringBootTest(webEnvironment = SpringBootTest.WebEnvironment.RANDOM_PORT, properties = {
        "spring.datasource.url=jdbc:h2:mem:preset-api-test;DB_CLOSE_DELAY=-1", "sieve.index.dir="})
class PresetApiTest {

    private static final HttpClient HTTP = HttpClient.newHttpClient();
    private static final JsonMapper JSON = JsonMapper.builder().build();

    @LocalServerPort
    int port;

    record Answer(int status, JsonNode json, HttpResponse<String> response) {
    }

    private Answer send(String method, String path, String body) throws Exception {
        HttpRequest.Builder b = HttpRequest.newBuilder(URI.create("http://localhost:" + port + path))
                .header("Content-Type", "application/json");
        b.method(method, body == null ? HttpRequest.BodyPublishers.noBody() : HttpRequest.BodyPublishers.ofString(body));
        HttpResponse<String> r = HTTP.send(b.build(), HttpResponse.BodyHandlers.ofString());
        return new Answer(r.statusCode(), r.body().isEmpty() ? null : JSON.readTree(r.body()), r);
    }

    private static String preset(String name, String text) {
        ObjectNode o = JSON.createObjectNode();
        o.put("name", name);
        o.put("text", text);
        o.put("note", "Larkspur Lane stock, illustrative");
        return o.toString();
    }

    private List<JsonNode> listed() throws Exception {
        Answer list = send("GET", "/api/presets", null);
        assertThat(list.status()).isEqualTo(200);
        return list.json().path("presets").valueStream().toList();
    }

    @Test
    void theListHoldsTheCatalogueWithReasonsSourcesAndTheCautionForSafetyPresets() throws Exception {
        List<JsonNode> catalogue = listed().stream().filter(p -> p.path("origin").asString().equals("catalogue")).toList();
        assertThat(catalogue).hasSize(20);
        JsonNode eyewear = catalogue.stream().filter(p -> p.path("name").asString().equals("eyewear-405")).findFirst().orElseThrow();
        assertThat(eyewear.path("caution").asString()).isEqualTo(SafetyCaution.TEXT);
        assertThat(eyewear.path("source").asString()).startsWith("[S14]");
        assertThat(eyewear.path("link").asString()).isEqualTo("/?preset=eyewear-405");
        JsonNode window = send("GET", "/api/presets/led-395-window", null).json();
        assertThat(window.path("text").asString()).isEqualTo("passes over 85% from 380 to 410 nm");
        assertThat(window.path("caution").isNull()).isTrue();
    }

    @Test
    void aSavedPresetIsListedAsMineFoundByIdAndNameEditedAndRetired() throws Exception {
        Answer created = send("POST", "/api/presets", preset("Fernhollow cover", "passes over 85% from 380 to 410 nm"));
        assertThat(created.status()).isEqualTo(201);
        long id = created.json().path("id").asLong();
        assertThat(created.json().path("origin").asString()).isEqualTo("mine");
        assertThat(created.json().path("link").asString()).isEqualTo("/?preset=" + id);
        assertThat(listed()).anyMatch(p -> p.path("id").asLong() == id && p.path("origin").asString().equals("mine"));
        assertThat(send("GET", "/api/presets/fernhollow%20COVER", null).json().path("id").asLong()).isEqualTo(id);

        Answer edited = send("PUT", "/api/presets/" + id, preset("Fernhollow cover", "passes over 90% from 380 to 410 nm"));
        assertThat(edited.status()).isEqualTo(200);
        assertThat(send("GET", "/api/presets/" + id, null).json().path("text").asString())
                .isEqualTo("passes over 90% from 380 to 410 nm");

        assertThat(send("DELETE", "/api/presets/" + id, null).status()).isEqualTo(200);
        Answer gone = send("GET", "/api/presets/" + id, null);
        assertThat(gone.status()).isEqualTo(404);
        assertThat(gone.json().path("resource").asString()).isEqualTo("preset");
        assertThat(listed()).noneMatch(p -> p.path("id").asLong() == id);

        Answer again = send("POST", "/api/presets", preset("Fernhollow cover", "passes over 80% at 365 nm"));
        assertThat(again.status()).as("a retired name is free again").isEqualTo(201);
        assertThat(again.json().path("id").asLong()).as("ids are never reused").isGreaterThan(id);
    }

    @Test
    void aTextTheLanguageDoesNotReadIsAProblemNamingTextWithThePosition() throws Exception {
        Answer bad = send("POST", "/api/presets", preset("Typo window", "passes over 80% at 365 nm and blokcs under 1% at 405 nm"));
        assertThat(bad.status()).isEqualTo(400);
        assertThat(bad.json().path("parameter").asString()).isEqualTo("text");
        assertThat(bad.json().path("position").asInt()).isEqualTo("passes over 80% at 365 nm and ".length());
        assertThat(bad.response().headers().firstValue("Content-Type")).hasValueSatisfying(
                t -> assertThat(t).startsWith("application/problem+json"));
    }

    @Test
    void badNamesNotesAndBodiesAreProblemsNamingTheField() throws Exception {
        assertThat(send("POST", "/api/presets", preset("", "passes over 80% at 365 nm")).json().path("parameter").asString())
                .isEqualTo("name");
        assertThat(send("POST", "/api/presets", preset("12345", "passes over 80% at 365 nm")).json().path("parameter").asString())
                .as("digits alone would read as an id").isEqualTo("name");
        assertThat(send("POST", "/api/presets", preset("a/b", "passes over 80% at 365 nm")).status()).isEqualTo(400);
        assertThat(send("POST", "/api/presets", preset("x".repeat(65), "passes over 80% at 365 nm")).status()).isEqualTo(400);
        ObjectNode longNote = (ObjectNode) JSON.readTree(preset("Noted", "passes over 80% at 365 nm"));
        longNote.put("note", "n".repeat(501));
        Answer note = send("POST", "/api/presets", longNote.toString());
        assertThat(note.status()).isEqualTo(400);
        assertThat(note.json().path("parameter").asString()).isEqualTo("note");
        assertThat(send("POST", "/api/presets", preset("Empty", " ")).json().path("parameter").asString()).isEqualTo("text");
        Answer builtIn = send("POST", "/api/presets", preset("led-395-window", "passes over 80% at 365 nm"));
        assertThat(builtIn.status()).isEqualTo(400);
        assertThat(builtIn.json().path("parameter").asString()).isEqualTo("name");
        assertThat(send("POST", "/api/presets", preset("Export", "passes over 80% at 365 nm")).json().path("parameter").asString())
                .as("a name the API's own paths use").isEqualTo("name");
        assertThat(send("POST", "/api/presets", "not json").status()).isEqualTo(400);
    }

    @Test
    void builtInPresetsAreReadOnlyAndUnknownOnesAreNotFound() throws Exception {
        Answer edit = send("PUT", "/api/presets/led-395-window", preset("Mine now", "passes over 80% at 365 nm"));
        assertThat(edit.status()).isEqualTo(403);
        assertThat(send("DELETE", "/api/presets/led-395-window", null).status()).isEqualTo(403);
        assertThat(send("GET", "/api/presets/no-such-preset", null).status()).isEqualTo(404);
        assertThat(send("DELETE", "/api/presets/987654", null).status()).isEqualTo(404);
    }

    @Test
    void aSecondPresetOfTheSameNameIsAConflictNamingTheField() throws Exception {
        assertThat(send("POST", "/api/presets", preset("Larkspur lid", "blocks under 1% from 300 to 500 nm")).status()).isEqualTo(201);
        Answer clash = send("POST", "/api/presets", preset("LARKSPUR lid", "blocks under 1% from 300 to 520 nm"));
        assertThat(clash.status()).isEqualTo(409);
        assertThat(clash.json().path("parameter").asString()).isEqualTo("name");
    }

    @Test
    void anExportReadsBackIntoAnotherNameAndABadEntryRefusesTheWholeImport() throws Exception {
        send("POST", "/api/presets", preset("Export sleeve", "passes over 80% at 254 nm"));
        Answer export = send("GET", "/api/presets/export", null);
        assertThat(export.status()).isEqualTo(200);
        assertThat(export.json().path("format").asString()).isEqualTo("spectral-sieve-presets");
        assertThat(export.json().path("version").asInt()).isEqualTo(1);
        assertThat(export.json().path("presets").valueStream().map(p -> p.path("name").asString())).contains("Export sleeve");
        assertThat(export.response().headers().firstValue("Content-Disposition")).hasValueSatisfying(
                d -> assertThat(d).contains("attachment"));

        Answer clash = send("POST", "/api/presets/import", export.json().toString());
        assertThat(clash.status()).as("the same names again").isEqualTo(409);
        assertThat(clash.json().path("parameter").asString()).matches("presets\\[\\d+]\\.name");

        ObjectNode file = JSON.createObjectNode();
        file.put("format", "spectral-sieve-presets");
        file.put("version", 1);
        ArrayNode entries = file.putArray("presets");
        entries.add(JSON.readTree(preset("Imported window", "passes over 85% from 355 to 415 nm")));
        entries.add(JSON.readTree(preset("Imported typo", "pases over 80% at 365 nm")));
        Answer bad = send("POST", "/api/presets/import", file.toString());
        assertThat(bad.status()).isEqualTo(400);
        assertThat(bad.json().path("parameter").asString()).isEqualTo("presets[1].text");
        assertThat(listed()).as("all or nothing").noneMatch(p -> p.path("name").asString().equals("Imported window"));

        entries.remove(1);
        Answer good = send("POST", "/api/presets/import", file.toString());
        assertThat(good.status()).isEqualTo(201);
        assertThat(good.json().path("imported").asInt()).isEqualTo(1);
        assertThat(listed()).anyMatch(p -> p.path("name").asString().equals("Imported window"));
    }

    @Test
    void aFileOfAnotherFormatOrVersionIsNamedAsSuch() throws Exception {
        Answer format = send("POST", "/api/presets/import", "{\"format\": \"something-else\", \"version\": 1, \"presets\": []}");
        assertThat(format.status()).isEqualTo(400);
        assertThat(format.json().path("parameter").asString()).isEqualTo("format");
        Answer version = send("POST", "/api/presets/import", "{\"format\": \"spectral-sieve-presets\", \"version\": 2, \"presets\": []}");
        assertThat(version.json().path("parameter").asString()).isEqualTo("version");
        Answer extra = send("POST", "/api/presets/import",
                "{\"format\": \"spectral-sieve-presets\", \"version\": 1, \"presets\": [{\"name\": \"A\", \"text\": \"passes over 1% at 400 nm\", \"colour\": \"red\"}]}");
        assertThat(extra.json().path("parameter").asString()).isEqualTo("presets[0].colour");
    }
}

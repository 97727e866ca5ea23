package org.spectralsieve.accounts;

import java.io.IOException;
import java.net.CookieManager;
import java.net.HttpCookie;
import java.net.URI;
import java.net.URLEncoder;
import java.net.http.HttpClient;
import java.net.http.HttpRequest;
import java.net.http.HttpResponse;
import java.nio.charset.StandardCharsets;
import java.util.Map;
import java.util.Optional;
import java.util.stream.Collectors;
import tools.jackson.databind.JsonNode;
import tools.jackson.databind.json.JsonMapper;

/**
 * A client of a server-mode test server: anonymous, with a bearer token, or as a browser with a session and
 * the CSRF cookie (its own cookie store, never following redirects so a test sees them).
 */
public final class ServerHttp {

    static final JsonMapper JSON = JsonMapper.builder().build();

    private final int port;
    private final CookieManager cookies = new CookieManager();
    private final HttpClient client;
    private String bearer;

    private ServerHttp(int port) {
        this.port = port;
        this.client = HttpClient.newBuilder().cookieHandler(cookies).followRedirects(HttpClient.Redirect.NEVER).build();
    }

    public static ServerHttp anonymous(int port) {
        return new ServerHttp(port);
    }

    public static ServerHttp withToken(int port, String token) {
        ServerHttp http = new ServerHttp(port);
        http.bearer = token;
        return http;
    }

    public record Answer(int status, String body, HttpResponse<String> response) {
        public JsonNode json() {
            return JSON.readTree(body);
        }

        public Optional<String> header(String name) {
            return response.headers().firstValue(name);
        }
    }

    public Answer get(String path) throws IOException, InterruptedException {
        return send(request(path).GET());
    }

    /** As a browser opens a page. */
    public Answer getPage(String path) throws IOException, InterruptedException {
        return send(HttpRequest.newBuilder(URI.create("http://localhost:" + port + path)).header("Accept", "text/html")
                .GET());
    }

    public Answer send(String method, String path, String json) throws IOException, InterruptedException {
        return send(request(path).header("Content-Type", "application/json")
                .method(method, HttpRequest.BodyPublishers.ofString(json)));
    }

    /** A change sent with the session and the token the page reads from the XSRF-TOKEN cookie. */
    public Answer sendWithCsrf(String method, String path, String json) throws IOException, InterruptedException {
        return send(request(path).header("Content-Type", "application/json").header("X-XSRF-TOKEN", csrfToken())
                .method(method, HttpRequest.BodyPublishers.ofString(json)));
    }

    /** Signs in as the page does: fetches the sign-in page for its CSRF cookie, then posts the form. */
    public Answer signIn(String name, String password) throws IOException, InterruptedException {
        if (csrfCookie().isEmpty()) {
            get("/sign-in.html");
        }
        String form = Map.of("username", name, "password", password).entrySet().stream()
                .map(e -> e.getKey() + "=" + URLEncoder.encode(e.getValue(), StandardCharsets.UTF_8))
                .collect(Collectors.joining("&"));
        Answer answer = send(request("/sign-in").header("Content-Type", "application/x-www-form-urlencoded")
                .header("X-XSRF-TOKEN", csrfToken()).POST(HttpRequest.BodyPublishers.ofString(form)));
        if (answer.status() == 200) {
            get("/api/session"); // the sign-in replaced the token: the next answer carries the new cookie
        }
        return answer;
    }

    String csrfToken() {
        return csrfCookie().orElseThrow(() -> new AssertionError("no XSRF-TOKEN cookie was set"));
    }

    private Optional<String> csrfCookie() {
        return cookies.getCookieStore().getCookies().stream().filter(c -> c.getName().equals("XSRF-TOKEN"))
                .map(HttpCookie::getValue).filter(v -> !v.isEmpty()).findFirst();
    }

    private HttpRequest.Builder request(String path) {
        HttpRequest.Builder builder = HttpRequest.newBuilder(URI.create("http://localhost:" + port + path))
                .header("Accept", "application/json, application/problem+json");
        if (bearer != null) {
            builder.header("Authorization", "Bearer " + bearer);
        }
        return builder;
    }

    private Answer send(HttpRequest.Builder builder) throws IOException, InterruptedException {
        HttpResponse<String> response = client.send(builder.build(), HttpResponse.BodyHandlers.ofString());
        return new Answer(response.statusCode(), response.body(), response);
    }
}

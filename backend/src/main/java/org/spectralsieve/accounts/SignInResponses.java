package org.spectralsieve.accounts;

import jakarta.servlet.http.HttpServletRequest;
import jakarta.servlet.http.HttpServletResponse;
import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.util.Map;
import org.spectralsieve.access.EdgeProblems;
import org.springframework.security.core.Authentication;
import org.springframework.security.core.AuthenticationException;
import org.springframework.security.web.authentication.AuthenticationFailureHandler;
import org.springframework.security.web.authentication.AuthenticationSuccessHandler;
import tools.jackson.databind.json.JsonMapper;

/**
 * The sign-in page posts with {@code fetch} and reads JSON back: success answers 200 with who is signed in;
 * a wrong name or password answers 401 with a problem (the same words for both, so the answer does not tell
 * which names exist) and counts against the name and the address ({@link SignInLimits}).
 */
final class SignInResponses implements AuthenticationSuccessHandler, AuthenticationFailureHandler {

    private static final JsonMapper JSON = JsonMapper.builder().build();

    private final SignInLimits limits;
    private final AccountStore store;

    SignInResponses(SignInLimits limits, AccountStore store) {
        this.limits = limits;
        this.store = store;
    }

    @Override
    public void onAuthenticationSuccess(HttpServletRequest request, HttpServletResponse response,
                                        Authentication authentication) throws IOException {
        Authentication now = store.findByName(authentication.getName())
                .<Authentication>map(a -> new SignedIn(a, "session")).orElse(authentication);
        byte[] body = JSON.writeValueAsBytes(SessionDescription.of(now));
        response.setStatus(HttpServletResponse.SC_OK);
        response.setContentType("application/json");
        response.setCharacterEncoding(StandardCharsets.UTF_8.name());
        response.getOutputStream().write(body);
    }

    @Override
    public void onAuthenticationFailure(HttpServletRequest request, HttpServletResponse response,
                                        AuthenticationException exception) throws IOException {
        limits.failed(SignInLimits.name(request), request.getRemoteAddr());
        EdgeProblems.write(request, response, HttpServletResponse.SC_UNAUTHORIZED, "sign-in-refused",
                "Sign-in refused", "the name and password do not match an active account", Map.of());
    }
}

package org.spectralsieve.accounts;

import jakarta.servlet.http.HttpServletRequest;
import java.time.Duration;
import java.util.Locale;
import java.util.Optional;

/** The two sign-in counters: per account name and per client address (docs/accounts-and-roles.md). */
record SignInLimits(SignInAttempts perName, SignInAttempts perAddress) {

    static final String SIGN_IN = "/sign-in";
    static final String NAME_PARAMETER = "username";

    /** The name as tried, folded so that case does not give an attacker fresh counters. */
    static String name(HttpServletRequest request) {
        String name = request.getParameter(NAME_PARAMETER);
        return name == null ? "" : name.strip().toLowerCase(Locale.ROOT);
    }

    Optional<Duration> lockedFor(String name, String address) {
        Optional<Duration> byName = perName.lockedFor(name);
        Optional<Duration> byAddress = perAddress.lockedFor(address);
        if (byName.isPresent() && byAddress.isPresent()) {
            return Optional.of(byName.get().compareTo(byAddress.get()) > 0 ? byName.get() : byAddress.get());
        }
        return byName.isPresent() ? byName : byAddress;
    }

    void failed(String name, String address) {
        perName.failed(name);
        perAddress.failed(address);
    }
}

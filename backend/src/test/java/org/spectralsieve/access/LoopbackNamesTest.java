package org.spectralsieve.access;

import static org.assertj.core.api.Assertions.assertThat;

import org.junit.jupiter.api.Test;

/** Which host names and listening addresses count as this machine only (RFC 6761 for .localhost; RFC 1122 for 127/8). */
class LoopbackNamesTest {

    @Test
    void loopbackNamesAreTheLocalhostNamesAndLoopbackLiterals() {
        assertThat(LoopbackHostFilter.isLoopbackName("localhost")).isTrue();
        assertThat(LoopbackHostFilter.isLoopbackName("LOCALHOST.")).isTrue();
        assertThat(LoopbackHostFilter.isLoopbackName("sieve.localhost")).isTrue();
        assertThat(LoopbackHostFilter.isLoopbackName("127.0.0.1")).isTrue();
        assertThat(LoopbackHostFilter.isLoopbackName("127.12.0.254")).isTrue();
        assertThat(LoopbackHostFilter.isLoopbackName("[::1]")).isTrue();
    }

    @Test
    void namesThatOnlyLookLocalAreForeign() {
        assertThat(LoopbackHostFilter.isLoopbackName("localhost.evil.example")).isFalse();
        assertThat(LoopbackHostFilter.isLoopbackName("evil-localhost")).isFalse();
        assertThat(LoopbackHostFilter.isLoopbackName("127.0.0.1.evil.example")).isFalse();
        assertThat(LoopbackHostFilter.isLoopbackName("127.0.0.256")).isFalse();
        assertThat(LoopbackHostFilter.isLoopbackName("10.0.0.1")).isFalse();
        assertThat(LoopbackHostFilter.isLoopbackName("")).isFalse();
    }

    @Test
    void onlyLoopbackAddressesKeepTheToolPrivate() {
        assertThat(new ListeningAddress("127.0.0.1").isLoopback()).isTrue();
        assertThat(new ListeningAddress("::1").isLoopback()).isTrue();
        assertThat(new ListeningAddress("0.0.0.0").isLoopback()).isFalse();
        assertThat(new ListeningAddress("").isLoopback()).isFalse();
        assertThat(new ListeningAddress(null).describe()).isEqualTo("every network interface");
    }
}

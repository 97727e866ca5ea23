package org.spectralsieve.accounts;

import static org.assertj.core.api.Assertions.assertThat;

import java.time.Clock;
import java.time.Duration;
import java.time.Instant;
import java.time.ZoneId;

import org.junit.jupiter.api.Test;

/** The sign-in counter on its own, with a clock the test moves (no waiting, nothing timed). */
class SignInAttemptsTest {

    /** A clock that stands still until the test moves it. */
    static final class MovableClock extends Clock {
        Instant now = Instant.parse("2026-03-01T09:00:00Z");

        @Override
        public ZoneId getZone() {
            return ZoneId.of("UTC");
        }

        @Override
        public Clock withZone(ZoneId zone) {
            return this;
        }

        @Override
        public Instant instant() {
            return now;
        }
    }

    @Test
    void aKeyIsLockedAfterItsLimitUntilTheWindowEnds() {
        MovableClock clock = new MovableClock();
        SignInAttempts attempts = new SignInAttempts(5, Duration.ofMinutes(15), 100, clock);
        for (int i = 0; i < 4; i++) {
            attempts.failed("wren");
        }
        assertThat(attempts.lockedFor("wren")).isEmpty();
        attempts.failed("wren");
        clock.now = clock.now.plusSeconds(60);
        assertThat(attempts.lockedFor("wren")).contains(Duration.ofMinutes(14));
        assertThat(attempts.lockedFor("juniper-admin")).isEmpty();

        clock.now = clock.now.plus(Duration.ofMinutes(14));
        assertThat(attempts.lockedFor("wren")).isEmpty();
        attempts.failed("wren");
        assertThat(attempts.lockedFor("wren")).as("a new window starts counting afresh").isEmpty();
    }

    @Test
    void theTrackedKeysNeverExceedTheCap() {
        SignInAttempts attempts = new SignInAttempts(5, Duration.ofMinutes(15), 50, new MovableClock());
        for (int i = 0; i < 10_000; i++) {
            attempts.failed("guessed-name-" + i);
            assertThat(attempts.trackedKeys()).isLessThanOrEqualTo(50);
        }
        assertThat(attempts.trackedKeys()).isEqualTo(50);
    }
}

package org.spectralsieve.accounts;

import java.time.Clock;
import java.time.Duration;
import java.time.Instant;
import java.util.LinkedHashMap;
import java.util.Map;
import java.util.Optional;

/**
 * Counts wrong passwords per key (an account name, or a client address) in a fixed window: once a key has
 * {@code limit} failures in its window, every further attempt is refused until the window ends, without the
 * password being checked. Kept in this process's memory (each node counts its own), and bounded: at most
 * {@code maxKeys} keys are tracked, the least recently touched forgotten first. Forgetting a key can only make
 * the limit milder for it; the per-address counter still stands against one client trying many names.
 */
public final class SignInAttempts {

    private final int limit;
    private final Duration window;
    private final int maxKeys;
    private final Clock clock;
    private final Map<String, Window> windows;

    private static final class Window {
        final Instant start;
        int failures;

        Window(Instant start) {
            this.start = start;
        }
    }

    public SignInAttempts(int limit, Duration window, int maxKeys, Clock clock) {
        this.limit = limit;
        this.window = window;
        this.maxKeys = maxKeys;
        this.clock = clock;
        this.windows = new LinkedHashMap<>(16, 0.75f, true) {
            @Override
            protected boolean removeEldestEntry(Map.Entry<String, Window> eldest) {
                return size() > SignInAttempts.this.maxKeys;
            }
        };
    }

    /** How long until {@code key} may try again, or empty when it may try now. */
    public synchronized Optional<Duration> lockedFor(String key) {
        Window w = current(key);
        if (w == null || w.failures < limit) {
            return Optional.empty();
        }
        return Optional.of(Duration.between(clock.instant(), w.start.plus(window)));
    }

    public synchronized void failed(String key) {
        Window w = current(key);
        if (w == null) {
            w = new Window(clock.instant());
            windows.put(key, w);
        }
        w.failures++;
    }

    /** The window of {@code key} while it runs; an ended one is forgotten. */
    private Window current(String key) {
        Window w = windows.get(key);
        if (w != null && !clock.instant().isBefore(w.start.plus(window))) {
            windows.remove(key);
            return null;
        }
        return w;
    }

    public synchronized int trackedKeys() {
        return windows.size();
    }
}

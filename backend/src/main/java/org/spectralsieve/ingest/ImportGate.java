package org.spectralsieve.ingest;

import java.util.concurrent.Semaphore;
import java.util.concurrent.TimeUnit;
import java.util.concurrent.atomic.AtomicInteger;

/**
 * Admits a bounded number of imports at once and lets a bounded number wait for a turn; one more is
 * turned away at once ({@link Busy}), and so is one that waited too long. The imports in flight are what
 * the service's memory must hold (each its upload and one inflated file), so this, not the upload rate,
 * decides whether the heap suffices.
 */
public final class ImportGate {

    /** No turn for this import now; worth trying again after {@link #retryAfterSeconds()}. */
    public static final class Busy extends RuntimeException {
        private final int retryAfterSeconds;
        private final int inFlight;
        private final int waiting;

        Busy(String message, int retryAfterSeconds, int inFlight, int waiting) {
            super(message);
            this.retryAfterSeconds = retryAfterSeconds;
            this.inFlight = inFlight;
            this.waiting = waiting;
        }

        public int retryAfterSeconds() {
            return retryAfterSeconds;
        }

        public int inFlight() {
            return inFlight;
        }

        public int waiting() {
            return waiting;
        }
    }

    /** Held while an import runs; closing it gives the turn to the next. */
    public interface Turn extends AutoCloseable {
        @Override
        void close();
    }

    private final Semaphore turns;
    private final int concurrent;
    private final int queue;
    private final long waitMillis;
    private final AtomicInteger waiting = new AtomicInteger();

    public ImportGate(int concurrent, int queue, long waitMillis) {
        if (concurrent < 1 || queue < 0 || waitMillis < 0) {
            throw new IllegalArgumentException("an import gate needs at least one turn and no negative queue or wait");
        }
        this.turns = new Semaphore(concurrent, true);
        this.concurrent = concurrent;
        this.queue = queue;
        this.waitMillis = waitMillis;
    }

    public static ImportGate of(ImportProperties limits) {
        return new ImportGate(limits.maxConcurrentImports(), limits.maxQueuedImports(),
                TimeUnit.SECONDS.toMillis(limits.queueWaitSeconds()));
    }

    /** A turn now, or after waiting in the queue; {@link Busy} when the queue is full or the wait ran out. */
    public Turn enter() {
        if (turns.tryAcquire()) {
            return turns::release;
        }
        if (waiting.incrementAndGet() > queue) {
            waiting.decrementAndGet();
            throw busy("the server is already working on " + concurrent + " imports and " + queue
                    + " more are waiting (sieve.imports.max-concurrent-imports, sieve.imports.max-queued-imports)");
        }
        try {
            if (!turns.tryAcquire(waitMillis, TimeUnit.MILLISECONDS)) {
                throw busy("no turn came within " + waitMillis / 1000 + " s (sieve.imports.queue-wait-seconds)");
            }
            return turns::release;
        } catch (InterruptedException e) {
            Thread.currentThread().interrupt();
            throw busy("the wait for a turn was interrupted");
        } finally {
            waiting.decrementAndGet();
        }
    }

    /** Imports waiting for a turn now. */
    public int waiting() {
        return waiting.get();
    }

    private Busy busy(String why) {
        // a turn takes seconds at most; suggest a wait that grows with what is already queued
        int retry = Math.max(1, (int) Math.min(60, 2L + waiting.get()));
        return new Busy(why + "; try again in " + retry + " s", retry, concurrent - turns.availablePermits(), waiting.get());
    }
}
